/** The network's hidden layers as the field shows them ("64, 64") and back; null when the text is not a list of whole numbers. */
export function formatHiddenLayers(layers: readonly number[]): string {
  return layers.join(', ');
}

export function parseHiddenLayers(text: string): number[] | null {
  const parts = text.split(/[,\s×x]+/).filter((p) => p !== '');
  if (parts.length === 0 || !parts.every((p) => /^\d+$/.test(p))) return null;
  return parts.map(Number);
}
