/** A table name used mid-sentence: "Dichloromethane" → "dichloromethane", "N,N-Dimethylformamide" → "N,N-dimethylformamide". */
export function inSentence(name: string): string {
  return name.replace(/\b([A-Z])(?=[a-z])/g, (c) => c.toLowerCase());
}

/** Volumes as people read them: mL, and L to one decimal from 1000 mL up. */
export function volumeText(volumeMl: number): string {
  return volumeMl >= 1000 ? `${(volumeMl / 1000).toFixed(1)} L` : `${Math.round(volumeMl)} mL`;
}
