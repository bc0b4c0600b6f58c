/** A moment as people read it on screens and in documents: "2026-11-20 16:30 UTC" (minutes, in UTC, so everyone reads the same). */
export function formatMoment(iso: string): string {
  return `${iso.slice(0, 16).replace('T', ' ')} UTC`;
}
