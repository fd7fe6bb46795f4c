/** Failures specific to the TensorFlow.js network path; messages say what to change. */

/** The network's action-value function was used after its fit was disposed. */
export class NetworkDisposedError extends Error {
  constructor(message = 'network action-value function: used after dispose(); fit the network again') {
    super(message);
    this.name = 'NetworkDisposedError';
  }
}

/** Training became non-finite or exploded before any outer iteration completed, so no good network exists. */
export class NetworkDivergedError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'NetworkDivergedError';
  }
}

/** The TensorFlow.js backend is not the one the network lives on, or could not be started. */
export class TfBackendError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'TfBackendError';
  }
}
