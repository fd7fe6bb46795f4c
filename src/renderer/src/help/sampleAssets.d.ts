/** Vite turns `?url` imports into the served URL of the asset, and `?raw` imports into the file's text. */
declare module '*.csv?url' {
  const url: string;
  export default url;
}
declare module '*.spcritic?raw' {
  const text: string;
  export default text;
}
