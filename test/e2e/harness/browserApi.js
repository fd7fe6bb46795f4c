// The browser-side AppApi of the e2e tests: injected with page.addInitScript before the app's own
// scripts, it defines window.setpointCritic over fetch('/__api/<method>') to the harness server,
// which runs the real main-process modules. Plain JavaScript because it is injected as text.
// Uint8Array travels as { "$bytes": "<base64>" } (RFC 4648 §4), as in wireCodec.ts.
// The harness sends menu commands with window.__setpointHarness.dispatchMenuCommand(command, detail).
(() => {
  if (window !== window.top) return;

  function bytesToBase64(bytes) {
    let binary = '';
    const chunk = 0x8000;
    for (let i = 0; i < bytes.length; i += chunk) binary += String.fromCharCode.apply(null, bytes.subarray(i, i + chunk));
    return btoa(binary);
  }

  function base64ToBytes(text) {
    const binary = atob(text);
    const bytes = new Uint8Array(binary.length);
    for (let i = 0; i < binary.length; i++) bytes[i] = binary.charCodeAt(i);
    return bytes;
  }

  function toWire(value) {
    if (value instanceof Uint8Array) return { $bytes: bytesToBase64(value) };
    if (Array.isArray(value)) return value.map(toWire);
    if (value !== null && typeof value === 'object') return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, toWire(v)]));
    return value;
  }

  function fromWire(value) {
    if (Array.isArray(value)) return value.map(fromWire);
    if (value !== null && typeof value === 'object') {
      const keys = Object.keys(value);
      if (keys.length === 1 && typeof value.$bytes === 'string') return base64ToBytes(value.$bytes);
      return Object.fromEntries(keys.map((k) => [k, fromWire(value[k])]));
    }
    return value;
  }

  async function post(method, args) {
    const response = await fetch(`/__api/${method}`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify({ args: toWire(args) }),
    });
    if (!response.ok) throw new Error(`${method}: the test server answered ${response.status}`);
    return fromWire(await response.json());
  }

  async function call(method, args) {
    const reply = await post(method, args);
    if (!reply.ok) throw new Error(reply.message);
    return reply.value;
  }

  const listeners = new Set();
  // One-way like ipcRenderer.send, and in order: each state waits for the one before it.
  let stateChain = Promise.resolve();
  const api = {
    host: 'browser',
    openProjectDialog: () => call('openProjectDialog', []),
    openRecentProject: (path) => call('openRecentProject', [path]),
    recentProjects: () => call('recentProjects', []),
    chooseDataFile: (projectPath) => call('chooseDataFile', [projectPath]),
    readProjectData: (projectPath, relativePath) => call('readProjectData', [projectPath, relativePath]),
    relocateDataFile: (projectPath) => call('relocateDataFile', [projectPath]),
    saveProject: (text, path, suggestedName) => call('saveProject', [text, path, suggestedName]),
    saveProjectAs: (text, suggestedName) => call('saveProjectAs', [text, suggestedName]),
    writeRecovery: (text, projectPath) => call('writeRecovery', [text, projectPath]),
    pendingRecovery: () => call('pendingRecovery', []),
    discardRecovery: () => call('discardRecovery', []),
    exportFile: (kind, suggestedName, bytes) => call('exportFile', [kind, suggestedName, bytes]),
    saveReportPdf: (html, suggestedName) => call('saveReportPdf', [html, suggestedName]),
    printReport: (html) => call('printReport', [html]),
    setDocumentState(state) {
      const args = [{ name: state.name, dirty: state.dirty }];
      stateChain = stateChain.then(() => post('setDocumentState', args)).catch(() => undefined);
    },
    onMenuCommand(listener) {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
  };

  Object.defineProperty(window, 'setpointCritic', { value: Object.freeze(api), writable: false, configurable: false });
  Object.defineProperty(window, '__setpointHarness', {
    value: Object.freeze({
      dispatchMenuCommand(command, detail) {
        for (const listener of [...listeners]) listener(command, detail);
        return listeners.size;
      },
    }),
  });
})();
