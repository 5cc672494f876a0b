/**
 * Everything a build reads, loaded and validated up front: sites, bulletin templates, objects,
 * and the list of pages for the build date. Every input problem is a positioned `GloamingError`
 * (file:line:column and field). Paths in messages are relative to the working directory.
 */
import { readFileSync } from 'node:fs';
import { join, relative, resolve } from 'node:path';
import type { BodyRegistry } from '../../lib/core/body.ts';
import { errorsOf, pagesFor, parseBulletin, throwErrors } from '../../lib/outputs/bulletin/index.ts';
import type { BulletinTemplate, PageSpec } from '../../lib/outputs/bulletin/types.ts';
import { CENTRE_FILE, loadCentre, type Centre } from '../../lib/outputs/centre.ts';
import { findSite, parseSite, projectRegistry, yamlFiles } from '../../lib/models/content.ts';
import { GloamingError } from '../../lib/core/errors.ts';
import { loadObjects } from '../../lib/models/orbit/body.ts';
import { loadSatellites } from '../../lib/models/satellite/catalogue.ts';
import type { Satellite } from '../../lib/models/satellite/passes.ts';
import type { Site } from '../../lib/core/site.ts';
import { codeDigest, filesUnder, hashFiles, sha256 } from './digest.ts';
import type { SiteBuildOptions } from './options.ts';

/** Where content lives inside the content folder. */
export const CONTENT_DIRS = { sites: 'sites', bulletins: 'bulletins', objects: 'objects', satellites: 'satellites' } as const;

export interface SiteSource {
  site: Site;
  /** Path as shown in messages. */
  file: string;
  /** SHA-256 of the file's text. */
  textDigest: string;
  /** The optional `description` field (not part of the computation model). */
  description: string;
}

export interface Project {
  root: string;
  today: string;
  /** The publishing centre (content/centre.yaml). */
  centre: Centre;
  /** Hash of centre.yaml and its logo file. */
  centreDigest: string;
  /** Every site, by id (the home page lists all of them, whatever the shard). */
  sites: Map<string, SiteSource>;
  /** The sites this build publishes pages for, in id order. */
  selected: SiteSource[];
  templates: BulletinTemplate[];
  /** SHA-256 of each template's text, by template file. */
  templateDigests: Map<string, string>;
  bodies: BodyRegistry;
  /** Satellites followed (content/satellites/): the tonight card, bulletin passes and the calendar feed. */
  satellites: Satellite[];
  /** Hash of every object file. */
  objectsDigest: string;
  /** Hash of the computing code (see `codeDigest`). */
  codeDigest: string;
  /** Pages of the selected sites. */
  pages: PageSpec[];
}

/** A path for messages: relative to the working directory when that is shorter. */
function shown(root: string, rel: string): string {
  const abs = resolve(root, rel);
  const fromCwd = relative(process.cwd(), abs);
  return fromCwd.length < abs.length ? fromCwd : abs;
}

function markdownFiles(dir: string): string[] {
  return filesUnder(dir, dir).filter((f) => f.endsWith('.md') && !f.includes('/'));
}

/** Loads and validates the project at `root` for the given options. */
export function loadProject(root: string, options: SiteBuildOptions): Project {
  const content = resolve(root, options.content);
  const sites = new Map<string, SiteSource>();
  // Every file is read and every problem collected before any stops the build.
  const errors: GloamingError[] = [];
  const each = (load: () => void): void => {
    try {
      load();
    } catch (error) {
      if (!(error instanceof GloamingError)) throw error;
      errors.push(...errorsOf(error));
    }
  };
  let centre: Centre | null = null;
  each(() => {
    centre = loadCentre(content, shown(content, '.'));
  });
  const defaultLocale = (centre as Centre | null)?.locale;
  for (const file of yamlFiles(shown(content, CONTENT_DIRS.sites))) {
    each(() => {
      const text = readFileSync(file, 'utf8');
      const site = parseSite(text, file, defaultLocale ? { defaultLocale } : {});
      if (sites.has(site.id)) {
        throw new GloamingError('invalid-value', `site id '${site.id}' is used twice`, {
          place: { file, field: 'id' },
          expected: `an id not used by ${sites.get(site.id)!.file}`,
        });
      }
      sites.set(site.id, { site, file, textDigest: sha256(text), description: site.description });
    });
  }
  const siteMap = new Map([...sites].map(([id, s]) => [id, s.site]));
  const selected = (options.only ?? [...sites.keys()].sort()).map((id) => sites.get(findSite(siteMap, id, { field: 'sites' }).id)!);

  const templateDir = shown(content, CONTENT_DIRS.bulletins);
  const templates: BulletinTemplate[] = [];
  const templateDigests = new Map<string, string>();
  for (const name of markdownFiles(join(content, CONTENT_DIRS.bulletins))) {
    const file = join(templateDir, name);
    each(() => {
      const text = readFileSync(file, 'utf8');
      templates.push(parseBulletin(text, file));
      templateDigests.set(file, sha256(text));
    });
  }

  const bodies = projectRegistry();
  each(() => {
    for (const body of loadObjects(shown(content, CONTENT_DIRS.objects))) bodies.add(body);
  });
  throwErrors(errors);
  const objectFiles = filesUnder(join(content, CONTENT_DIRS.objects), content);
  // Satellites (optional): their files join the objects' digest, as both feed the same pages.
  const satellites = loadSatellites(shown(content, CONTENT_DIRS.satellites));
  const satelliteFiles = filesUnder(join(content, CONTENT_DIRS.satellites), content);

  const wanted = new Set(selected.map((s) => s.site.id));
  const pages = pagesFor(templates, { sites: siteMap, today: options.today }).filter((p) => wanted.has(p.site.id));
  const theCentre = centre as unknown as Centre;
  const centreFiles = [CENTRE_FILE, ...(theCentre.logoFile ? [relative(content, theCentre.logoFile)] : [])];
  return {
    root,
    today: options.today,
    centre: theCentre,
    centreDigest: hashFiles(content, centreFiles),
    sites,
    selected,
    templates,
    templateDigests,
    bodies,
    satellites,
    objectsDigest: hashFiles(content, [...objectFiles, ...satelliteFiles]),
    codeDigest: codeDigest(root),
    pages,
  };
}
