/** What a build publishes: the build date, the sites (a CI shard) and the content folder. */
export interface SiteBuildOptions {
  /** The build date, YYYY-MM-DD; its ISO week is "this week". */
  today: string;
  /** Site ids to build (a CI shard), or null for all. Sorted, unique. */
  only: string[] | null;
  /** Content folder (sites/, bulletins/, objects/), absolute or relative to the project root; default `content`. */
  content: string;
}

/** Reads a comma-separated site list ("a,b"); empty gives null (all sites). */
export function parseSiteList(text: string | undefined): string[] | null {
  const ids = [...new Set((text ?? '').split(',').map((s) => s.trim()).filter(Boolean))].sort();
  return ids.length ? ids : null;
}
