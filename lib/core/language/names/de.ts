/**
 * German names of the star patterns and bodies, each with its dative for sentences ("im Großen
 * Wagen", "rechts vom Löwen"). Constellations by their German names (Großer Wagen, Löwe, Kreuz
 * des Südens); asterisms as German amateurs call them (Himmels-W, Sommerdreieck, Herbstviereck,
 * Wintersechseck). IAU proper names of stars stay as they are (Polaris, Arcturus, Spica).
 * Source: common usage, from memory.
 */
import { body, pattern, type LanguageNames } from './types.ts';

export const de: LanguageNames = {
  source: 'common usage, from memory',
  patterns: {
    'big-dipper': pattern('Großer Wagen', 'der Große Wagen', 'masculine', 'dem Großen Wagen', {
      bowl: ['der Kasten des Großen Wagens', 'masculine', 'dem Kasten des Großen Wagens'],
      handle: ['die Deichsel des Großen Wagens', 'feminine', 'der Deichsel des Großen Wagens'],
      Pointers: ['die Zeigersterne des Großen Wagens', 'plural-masculine', 'den Zeigersternen des Großen Wagens'],
    }),
    'little-dipper': pattern('Kleiner Wagen', 'der Kleine Wagen', 'masculine', 'dem Kleinen Wagen', {
      bowl: ['der Kasten des Kleinen Wagens', 'masculine', 'dem Kasten des Kleinen Wagens'],
      handle: ['die Deichsel des Kleinen Wagens, die bei Polaris endet', 'feminine', 'der Deichsel des Kleinen Wagens, die bei Polaris endet'],
    }),
    cassiopeia: pattern('Himmels-W', 'das Himmels-W der Kassiopeia', 'neuter', 'dem Himmels-W der Kassiopeia'),
    'summer-triangle': pattern('Sommerdreieck', 'das Sommerdreieck', 'neuter', 'dem Sommerdreieck'),
    'great-square': pattern('Herbstviereck', 'das Herbstviereck des Pegasus', 'neuter', 'dem Herbstviereck des Pegasus'),
    orion: pattern('Orion', 'der Orion', 'masculine', 'dem Orion', {
      belt: ['der Gürtel des Orion', 'masculine', 'dem Gürtel des Orion'],
      shoulders: ['die Schultern des Orion (Betelgeuse und Bellatrix)', 'plural-feminine', 'den Schultern des Orion (Betelgeuse und Bellatrix)'],
      feet: ['die Füße des Orion (Rigel und Saiph)', 'plural-masculine', 'den Füßen des Orion (Rigel und Saiph)'],
      sword: ['das Schwert des Orion', 'neuter', 'dem Schwert des Orion'],
    }),
    leo: pattern('Löwe', 'der Löwe', 'masculine', 'dem Löwen', {
      Sickle: ['die Sichel des Löwen', 'feminine', 'der Sichel des Löwen'],
      hindquarters: ['das Dreieck am Hinterteil des Löwen', 'neuter', 'dem Dreieck am Hinterteil des Löwen'],
    }),
    teapot: pattern('Teekanne', 'die Teekanne des Schützen', 'feminine', 'der Teekanne des Schützen', {
      spout: ['der Ausguss der Teekanne', 'masculine', 'dem Ausguss der Teekanne'],
      lid: ['der Deckel der Teekanne', 'masculine', 'dem Deckel der Teekanne'],
      handle: ['der Henkel der Teekanne', 'masculine', 'dem Henkel der Teekanne'],
    }),
    'southern-cross': pattern('Kreuz des Südens', 'das Kreuz des Südens', 'neuter', 'dem Kreuz des Südens'),
    centaurus: pattern('Zentaur', 'der Zentaur', 'masculine', 'dem Zentauren', {
      Pointers: ['die Zeigersterne (Alpha und Beta Centauri)', 'plural-masculine', 'den Zeigersternen (Alpha und Beta Centauri)'],
    }),
    pleiades: pattern('Plejaden', 'die Plejaden', 'plural-feminine', 'den Plejaden'),
    taurus: pattern('Stier', 'der Stier', 'masculine', 'dem Stier', {
      V: ['das V der Hyaden im Stier', 'neuter', 'dem V der Hyaden im Stier'],
      horns: ['die Hörner des Stiers', 'plural-masculine', 'den Hörnern des Stiers'],
    }),
    scorpius: pattern('Skorpion', 'der Skorpion', 'masculine', 'dem Skorpion', {
      head: ['der Kopf des Skorpions', 'masculine', 'dem Kopf des Skorpions'],
      heart: ['das Herz des Skorpions', 'neuter', 'dem Herzen des Skorpions'],
      curve: ['der gebogene Schwanz des Skorpions', 'masculine', 'dem gebogenen Schwanz des Skorpions'],
      sting: ['der Stachel des Skorpions', 'masculine', 'dem Stachel des Skorpions'],
    }),
    'winter-hexagon': pattern('Wintersechseck', 'das Wintersechseck', 'neuter', 'dem Wintersechseck'),
    'winter-triangle': pattern('Winterdreieck', 'das Winterdreieck', 'neuter', 'dem Winterdreieck'),
    'spring-triangle': pattern('Frühlingsdreieck', 'das Frühlingsdreieck', 'neuter', 'dem Frühlingsdreieck'),
    'spring-arc': pattern('Frühlingsbogen', 'der Bogen von der Deichsel des Großen Wagens zu Arcturus und Spica', 'masculine', 'dem Bogen von der Deichsel des Großen Wagens zu Arcturus und Spica'),
    'northern-cross': pattern('Nördliches Kreuz', 'das Nördliche Kreuz', 'neuter', 'dem Nördlichen Kreuz', {
      upright: ['der lange Balken des Nördlichen Kreuzes (Deneb bis Albireo)', 'masculine', 'dem langen Balken des Nördlichen Kreuzes (Deneb bis Albireo)'],
      crossbar: ['der Querbalken des Nördlichen Kreuzes', 'masculine', 'dem Querbalken des Nördlichen Kreuzes'],
    }),
    lyra: pattern('Leier', 'die Leier', 'feminine', 'der Leier', {
      parallelogram: ['das kleine Parallelogramm der Leier', 'neuter', 'dem kleinen Parallelogramm der Leier'],
    }),
    aquila: pattern('Adler', 'der Adler', 'masculine', 'dem Adler'),
    auriga: pattern('Fuhrmann', 'der Fuhrmann', 'masculine', 'dem Fuhrmann', {
      pentagon: ['das Fünfeck des Fuhrmanns', 'neuter', 'dem Fünfeck des Fuhrmanns'],
      Kids: ['die Böckchen, das kleine Dreieck neben Capella', 'plural-masculine', 'den Böckchen, dem kleinen Dreieck neben Capella'],
    }),
    perseus: pattern('Perseus', 'der Perseus', 'masculine', 'dem Perseus'),
    andromeda: pattern('Andromeda', 'die Andromeda', 'feminine', 'der Andromeda', {
      chain: ['die Sternenkette der Andromeda', 'feminine', 'der Sternenkette der Andromeda'],
    }),
    capricornus: pattern('Steinbock', 'der Steinbock', 'masculine', 'dem Steinbock'),
    carina: pattern('Canopus und Kiel des Schiffs', 'Canopus und der Kiel des Schiffs', 'plural-masculine', 'Canopus und dem Kiel des Schiffs'),
    'false-cross': pattern('Falsches Kreuz', 'das Falsche Kreuz', 'neuter', 'dem Falschen Kreuz'),
    'triangulum-australe': pattern('Südliches Dreieck', 'das Südliche Dreieck', 'neuter', 'dem Südlichen Dreieck'),
    grus: pattern('Kranich', 'der Kranich', 'masculine', 'dem Kranich'),
    'piscis-austrinus': pattern('Südlicher Fisch', 'Fomalhaut und der Südliche Fisch', 'plural-masculine', 'Fomalhaut und dem Südlichen Fisch'),
    'achernar-hydrus': pattern('Achernar und Kleine Wasserschlange', 'Achernar und das Dreieck der Kleinen Wasserschlange', 'plural-masculine', 'Achernar und dem Dreieck der Kleinen Wasserschlange'),
    gemini: pattern('Zwillinge', 'die Zwillinge', 'plural-masculine', 'den Zwillingen', {
      heads: ['die Köpfe der Zwillinge', 'plural-masculine', 'den Köpfen der Zwillinge'],
      feet: ['die Füße der Zwillinge', 'plural-masculine', 'den Füßen der Zwillinge'],
    }),
    corvus: pattern('Rabe', 'der Rabe', 'masculine', 'dem Raben'),
    bootes: pattern('Drachen des Bootes', 'der Drachen des Bootes', 'masculine', 'dem Drachen des Bootes'),
    'corona-borealis': pattern('Nördliche Krone', 'die Nördliche Krone', 'feminine', 'der Nördlichen Krone'),
    hercules: pattern('Herkules', 'der Herkules', 'masculine', 'dem Herkules', {
      Keystone: ['der Schlussstein des Herkules', 'masculine', 'dem Schlussstein des Herkules'],
    }),
    delphinus: pattern('Delfin', 'der Delfin', 'masculine', 'dem Delfin'),
    'canis-major': pattern('Großer Hund', 'der Große Hund', 'masculine', 'dem Großen Hund'),
    'canis-minor': pattern('Kleiner Hund', 'der Kleine Hund', 'masculine', 'dem Kleinen Hund'),
    virgo: pattern('Jungfrau', 'die Jungfrau', 'feminine', 'der Jungfrau'),
    libra: pattern('Waage', 'die Waage', 'feminine', 'der Waage'),
    aries: pattern('Widder', 'der Widder', 'masculine', 'dem Widder'),
    cepheus: pattern('Kepheus', 'der Kepheus', 'masculine', 'dem Kepheus'),
    'draco-head': pattern('Kopf des Drachen', 'der Kopf des Drachen', 'masculine', 'dem Kopf des Drachen'),
    ophiuchus: pattern('Schlangenträger', 'der Schlangenträger', 'masculine', 'dem Schlangenträger'),
    lepus: pattern('Hase', 'der Hase', 'masculine', 'dem Hasen'),
    hydra: pattern('Kopf der Wasserschlange', 'der Kopf der Wasserschlange', 'masculine', 'dem Kopf der Wasserschlange'),
    circlet: pattern('Ring der Fische', 'der Ring der Fische', 'masculine', 'dem Ring der Fische'),
  },
  bodies: {
    // Meteor showers by IAU code (common usage, from memory).
    'shower:QUA': body('Quadrantiden', 'die Quadrantiden', 'plural-feminine', 'den Quadrantiden'),
    'shower:LYR': body('Lyriden', 'die Lyriden', 'plural-feminine', 'den Lyriden'),
    'shower:ETA': body('Eta-Aquariiden', 'die Eta-Aquariiden', 'plural-feminine', 'den Eta-Aquariiden'),
    'shower:SDA': body('Südliche Delta-Aquariiden', 'die Südliche Delta-Aquariiden', 'plural-feminine', 'den Südliche Delta-Aquariiden'),
    'shower:PER': body('Perseiden', 'die Perseiden', 'plural-feminine', 'den Perseiden'),
    'shower:DRA': body('Draconiden', 'die Draconiden', 'plural-feminine', 'den Draconiden'),
    'shower:ORI': body('Orioniden', 'die Orioniden', 'plural-feminine', 'den Orioniden'),
    'shower:LEO': body('Leoniden', 'die Leoniden', 'plural-feminine', 'den Leoniden'),
    'shower:GEM': body('Geminiden', 'die Geminiden', 'plural-feminine', 'den Geminiden'),
    'shower:URS': body('Ursiden', 'die Ursiden', 'plural-feminine', 'den Ursiden'),
    sun: body('Sonne', 'die Sonne', 'feminine', 'der Sonne'),
    moon: body('Mond', 'der Mond', 'masculine', 'dem Mond'),
    mercury: body('Merkur', 'Merkur', 'masculine'),
    venus: body('Venus', 'Venus', 'feminine'),
    mars: body('Mars', 'Mars', 'masculine'),
    jupiter: body('Jupiter', 'Jupiter', 'masculine'),
    saturn: body('Saturn', 'Saturn', 'masculine'),
    uranus: body('Uranus', 'Uranus', 'masculine'),
    neptune: body('Neptun', 'Neptun', 'masculine'),
  },
};
