/** The session's folders, from the `gloaming()` integration (site/gloaming/integration.ts). */
declare module 'virtual:gloaming' {
  /** Social cards: kept in `<dir>/cards/`, keyed by their inputs and the code digest. */
  export const cards: { dir: string; codeDigest: string };
  /** Finder charts: `<dir>/<key>.svg`. */
  export const charts: { dir: string };
}
