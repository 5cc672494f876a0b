/**
 * Content loading: sites from `content/sites/*.yaml`. Each file is parsed with positions, so a
 * bad value is reported as `file:line:column field '…': what is wrong; what is expected`.
 */
import { DEEP_SKY } from './deep-sky/catalogue.ts';
import { readFileSync } from 'node:fs';
import { basename } from 'node:path';
import { BodyRegistry } from '../core/body.ts';
import { GloamingError, didYouMean } from '../core/errors.ts';
import { loadObjects } from './orbit/body.ts';
import { defineSite, type Site } from '../core/site.ts';
import { loadYaml, validateYaml, yamlFiles } from '../core/yaml.ts';

export { yamlFiles };

/**
 * Parses one site file. The id defaults to the file name without `.yaml`, the locale to
 * `defaultLocale` (the centre's, from content/centre.yaml) when given.
 */
export function parseSite(text: string, file: string, options: { defaultLocale?: string } = {}): Site {
  const source = loadYaml(text, file);
  return validateYaml(source, (data) => {
    if (!data || typeof data !== 'object' || Array.isArray(data)) return defineSite(data);
    const defaults = { id: basename(file).replace(/\.ya?ml$/, ''), ...(options.defaultLocale ? { locale: options.defaultLocale } : {}) };
    return defineSite({ ...defaults, ...data });
  });
}

/** Loads all sites of `content/sites/` (or another folder), checking that ids are unique. */
export function loadSites(dir: string): Map<string, Site> {
  const sites = new Map<string, Site>();
  for (const file of yamlFiles(dir)) {
    const site = parseSite(readFileSync(file, 'utf8'), file);
    if (sites.has(site.id)) {
      throw new GloamingError('invalid-value', `site id '${site.id}' is used twice`, { place: { file, field: 'id' }, expected: 'a unique id per site' });
    }
    sites.set(site.id, site);
  }
  return sites;
}

/** The site with `id`, or an `unknown-site` error with a suggestion. */
export function findSite(sites: Map<string, Site>, id: string, place?: { field?: string }): Site {
  const site = sites.get(id);
  if (site) return site;
  const hint = didYouMean(id, sites.keys());
  throw new GloamingError('unknown-site', `unknown site '${id}'`, {
    ...(place ? { place } : {}),
    expected: sites.size ? `one of ${[...sites.keys()].join(', ')}` : 'a site defined in content/sites/',
    ...(hint ? { hint } : {}),
  });
}

/**
 * A registry of the built-in bodies that also finds the deep-sky table's objects by id (`m31`,
 * `ngc869`, `albireo`); content objects are added to it.
 */
export function projectRegistry(): BodyRegistry {
  return new BodyRegistry({ catalogues: [DEEP_SKY] });
}

/** The built-in bodies plus every object of `content/objects/` (or another folder), and the deep-sky table by id. */
export function loadBodies(objectsDir: string): BodyRegistry {
  const registry = projectRegistry();
  for (const body of loadObjects(objectsDir)) registry.add(body);
  return registry;
}
