/** A feature-map specification (usually read from a project file) that cannot be used as given. */
export class FeatureSpecError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'FeatureSpecError';
  }
}
