/** Vite turns `import url from 'file.wasm?url'` into the served URL of the (hashed) asset. */
declare module '*.wasm?url' {
  const url: string;
  export default url;
}
