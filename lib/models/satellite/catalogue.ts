/**
 * The satellites a centre follows: `content/satellites/satellites.yaml` names each one (id,
 * catalogue number, display name, standard magnitude), and the element-set files beside it
 * (`*.tle`, `*.txt`, `*.json`, `*.xml`, one or many objects each) give their orbits. When several
 * files hold the same object, the element set with the latest epoch wins, so a refreshed file can
 * simply be dropped in next to older ones.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { GloamingError } from '../../core/errors.ts';
import { loadYaml, validateYaml } from '../../core/yaml.ts';
import { ELEMENT_FILE_FORMATS, readElementFile, type ElementSet } from './elements.ts';
import type { Satellite } from './passes.ts';

export const CATALOGUE_FILE = 'satellites.yaml';
const FIELDS = ['id', 'norad', 'name', 'standardMagnitude'];

/** Parses the catalogue list: `[{ id, norad, name, standardMagnitude }]`. */
export function parseCatalogue(text: string, file: string): { id: string; noradId: number; name: string; standardMagnitude: number; field: string }[] {
  const source = loadYaml(text, file);
  return validateYaml(source, (data) => {
    if (!Array.isArray(data)) throw new GloamingError('invalid-value', 'the satellite list must be a YAML list', { expected: 'a list of { id, norad, name, standardMagnitude }' });
    const ids = new Set<string>();
    return data.map((item: unknown, i) => {
      const field = String(i);
      if (!item || typeof item !== 'object' || Array.isArray(item)) throw new GloamingError('invalid-value', 'a satellite entry must be a mapping', { place: { field }, expected: '{ id, norad, name, standardMagnitude }' });
      const entry = item as Record<string, unknown>;
      for (const key of Object.keys(entry)) {
        if (!FIELDS.includes(key)) throw new GloamingError('unknown-field', `unknown field '${key}'`, { place: { field: `${field}.${key}` }, expected: `one of ${FIELDS.join(', ')}` });
      }
      const id = entry.id;
      if (typeof id !== 'string' || !/^[a-z0-9][a-z0-9-]*$/.test(id)) throw new GloamingError('invalid-value', 'satellite id must be lower-case letters, digits and hyphens', { place: { field: `${field}.id` }, actual: id, expected: "an id like 'space-station'" });
      if (ids.has(id)) throw new GloamingError('invalid-value', `satellite id '${id}' is used twice`, { place: { field: `${field}.id` }, expected: 'a unique id per satellite' });
      ids.add(id);
      const norad = entry.norad;
      if (typeof norad !== 'number' || !Number.isInteger(norad) || norad < 1 || norad > 339_999) throw new GloamingError('invalid-value', 'norad must be a catalogue number', { place: { field: `${field}.norad` }, actual: norad, expected: 'an integer from 1 to 339999' });
      const name = entry.name;
      if (typeof name !== 'string' || !name.trim()) throw new GloamingError('missing-field', 'name is required', { place: { field: `${field}.name` }, expected: 'the name to print, e.g. "Space station"' });
      const mag = entry.standardMagnitude;
      if (typeof mag !== 'number' || !Number.isFinite(mag) || mag < -5 || mag > 12) throw new GloamingError('invalid-value', 'standardMagnitude must be a magnitude', { place: { field: `${field}.standardMagnitude` }, actual: mag, expected: 'the magnitude at 1000 km and 90° phase angle, −5 to 12' });
      return { id, noradId: norad, name: name.trim(), standardMagnitude: mag, field };
    });
  });
}

/** Every element set of the folder's element files, newest epoch per catalogue number. */
export function loadElementSets(dir: string): Map<number, ElementSet> {
  const byId = new Map<number, ElementSet>();
  const files = readdirSync(dir).filter((n) => Object.keys(ELEMENT_FILE_FORMATS).some((e) => n.toLowerCase().endsWith(e))).sort();
  for (const name of files) {
    const file = join(dir, name);
    for (const set of readElementFile(readFileSync(file, 'utf8'), file)) {
      const old = byId.get(set.noradId);
      if (!old || set.epoch > old.epoch) byId.set(set.noradId, set);
    }
  }
  return byId;
}

/**
 * The satellites of a folder (`content/satellites/`): an empty list when the folder or its
 * `satellites.yaml` is missing; an error naming the entry when a listed satellite has no element set.
 */
export function loadSatellites(dir: string): Satellite[] {
  let text: string;
  try {
    text = readFileSync(join(dir, CATALOGUE_FILE), 'utf8');
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return [];
    throw error;
  }
  const file = join(dir, CATALOGUE_FILE);
  const entries = parseCatalogue(text, file);
  const sets = loadElementSets(dir);
  const source = loadYaml(text, file);
  return entries.map((entry) => {
    const elements = sets.get(entry.noradId);
    if (!elements) {
      throw new GloamingError('missing-field', `no element set for ${entry.name} (catalogue number ${entry.noradId})`, {
        place: source.locate(`${entry.field}.norad`),
        expected: `an element file in ${dir} (${Object.keys(ELEMENT_FILE_FORMATS).join(', ')}) holding object ${entry.noradId}`,
      });
    }
    return { id: entry.id, name: entry.name, noradId: entry.noradId, standardMagnitude: entry.standardMagnitude, elements };
  });
}
