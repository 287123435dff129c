/**
 * Venue ids typed as a list. Venues get their own picker once the tour screens exist; until then
 * an administrator pastes ids separated by commas, spaces or new lines.
 */
export function parseIdList(text: string): string[] {
  return [...new Set(text.split(/[\s,;]+/).map((s) => s.trim()).filter(Boolean))];
}
