/** The session's folders, from the `gloaming()` integration (site/gloaming/integration.ts). */
declare module 'virtual:gloaming' {
  /** Social cards: kept in `<dir>/cards/`, keyed by their inputs and the code digest. */
  export const cards: { dir: string; codeDigest: string };
  /** Finder charts: `<dir>/<key>.svg`. */
  export const charts: { dir: string };
  /** The entries' long texts: `<dir>/<sha256>.html` (a page entry's `htmlFile`), `<dir>/<sha256>.ics` (a site entry's `calendarFile`). */
  export const texts: { dir: string };
}
