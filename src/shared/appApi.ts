/** The typed API the preload script exposes to the renderer as `window.setpointCritic`. */
export interface AppApi {
  readonly host: 'electron' | 'browser';
  readonly versions: { readonly electron: string; readonly chrome: string };
}
