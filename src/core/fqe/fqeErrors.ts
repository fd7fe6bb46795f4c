/** Options of a fitted Q-evaluation that cannot be used (messages name the option and value). */
export class FqeOptionsError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'FqeOptionsError';
  }
}

/** The data or features make the least-squares problem unsolvable as posed. */
export class FqeDataError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'FqeDataError';
  }
}

/** The caller asked the fit to stop. */
export class FqeCancelledError extends Error {
  constructor(message = 'fitted Q-evaluation was cancelled') {
    super(message);
    this.name = 'FqeCancelledError';
  }
}
