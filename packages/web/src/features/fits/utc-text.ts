// The desk speaks UTC throughout, as the timings do; a local clock time would invite mix-ups.
export function utcText(iso: string): string {
  return `${iso.slice(0, 19).replace('T', ' ')} UTC`;
}
