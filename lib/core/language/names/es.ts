/**
 * Spanish names of the star patterns and bodies. Constellations keep their usual Spanish names
 * (Osa Mayor, Escorpio, Cruz del Sur); asterisms the names Spanish-speaking amateurs use (el Carro,
 * la W de Casiopea, el Triángulo de Verano, las Tres Marías for Orion's belt in Chile and much of
 * Latin America). IAU proper names of stars stay as they are (Polaris, Arcturus, Spica).
 * Source: common usage, from memory.
 */
import { body, pattern, type LanguageNames } from './types.ts';

export const es: LanguageNames = {
  source: 'common usage, from memory',
  patterns: {
    'big-dipper': pattern('Carro de la Osa Mayor', 'el Carro de la Osa Mayor', 'masculine', undefined, {
      bowl: ['la caja del Carro de la Osa Mayor', 'feminine'],
      handle: ['el timón del Carro de la Osa Mayor', 'masculine'],
      Pointers: ['las estrellas guía del Carro de la Osa Mayor', 'plural-feminine'],
    }),
    'little-dipper': pattern('Carro de la Osa Menor', 'el Carro de la Osa Menor', 'masculine', undefined, {
      bowl: ['la caja del Carro de la Osa Menor', 'feminine'],
      handle: ['el timón del Carro de la Osa Menor, que termina en Polaris', 'masculine'],
    }),
    cassiopeia: pattern('W de Casiopea', 'la W de Casiopea', 'feminine'),
    'summer-triangle': pattern('Triángulo de Verano', 'el Triángulo de Verano', 'masculine'),
    'great-square': pattern('Gran Cuadrado de Pegaso', 'el Gran Cuadrado de Pegaso', 'masculine'),
    orion: pattern('Orión', 'Orión', 'masculine', undefined, {
      belt: ['el Cinturón de Orión (las Tres Marías)', 'masculine'],
      shoulders: ['los hombros de Orión (Betelgeuse y Bellatrix)', 'plural-masculine'],
      feet: ['los pies de Orión (Rigel y Saiph)', 'plural-masculine'],
      sword: ['la Espada de Orión', 'feminine'],
    }),
    leo: pattern('Leo', 'Leo', 'masculine', undefined, {
      Sickle: ['la Hoz de Leo', 'feminine'],
      hindquarters: ['el triángulo de los cuartos traseros de Leo', 'masculine'],
    }),
    teapot: pattern('Tetera', 'la Tetera de Sagitario', 'feminine', undefined, {
      spout: ['el pico de la Tetera de Sagitario', 'masculine'],
      lid: ['la tapa de la Tetera de Sagitario', 'feminine'],
      handle: ['el asa de la Tetera de Sagitario', 'feminine'],
    }),
    'southern-cross': pattern('Cruz del Sur', 'la Cruz del Sur', 'feminine'),
    centaurus: pattern('Centauro', 'Centauro', 'masculine', undefined, { Pointers: ['los Punteros (Alfa y Beta Centauri)', 'plural-masculine'] }),
    pleiades: pattern('Pléyades', 'las Pléyades', 'plural-feminine'),
    taurus: pattern('Tauro', 'Tauro', 'masculine', undefined, {
      V: ['la V de las Híades en Tauro', 'feminine'],
      horns: ['los cuernos de Tauro', 'plural-masculine'],
    }),
    scorpius: pattern('Escorpio', 'Escorpio', 'masculine', undefined, {
      head: ['la cabeza de Escorpio', 'feminine'],
      heart: ['el corazón de Escorpio', 'masculine'],
      curve: ['la cola curva de Escorpio', 'feminine'],
      sting: ['el aguijón de Escorpio', 'masculine'],
    }),
    'winter-hexagon': pattern('Hexágono de Invierno', 'el Hexágono de Invierno', 'masculine'),
    'winter-triangle': pattern('Triángulo de Invierno', 'el Triángulo de Invierno', 'masculine'),
    'spring-triangle': pattern('Triángulo de Primavera', 'el Triángulo de Primavera', 'masculine'),
    'spring-arc': pattern('Arco de Primavera', 'el arco que va del timón del Carro a Arcturus y Spica', 'masculine'),
    'northern-cross': pattern('Cruz del Norte', 'la Cruz del Norte', 'feminine', undefined, {
      upright: ['el brazo largo de la Cruz del Norte (de Deneb a Albireo)', 'masculine'],
      crossbar: ['el travesaño de la Cruz del Norte', 'masculine'],
    }),
    lyra: pattern('Lira', 'Lira', 'feminine', undefined, { parallelogram: ['el pequeño paralelogramo de Lira', 'masculine'] }),
    aquila: pattern('Águila', 'el Águila', 'feminine'),
    auriga: pattern('Auriga', 'Auriga', 'masculine', undefined, {
      pentagon: ['el pentágono de Auriga', 'masculine'],
      Kids: ['los Cabritos, el pequeño triángulo junto a Capella', 'plural-masculine'],
    }),
    perseus: pattern('Perseo', 'Perseo', 'masculine'),
    andromeda: pattern('Andrómeda', 'Andrómeda', 'feminine', undefined, { chain: ['la cadena de Andrómeda', 'feminine'] }),
    capricornus: pattern('Capricornio', 'Capricornio', 'masculine'),
    carina: pattern('Canopus y Carina', 'Canopus y la quilla de Carina', 'plural-masculine'),
    'false-cross': pattern('Falsa Cruz', 'la Falsa Cruz', 'feminine'),
    'triangulum-australe': pattern('Triángulo Austral', 'el Triángulo Austral', 'masculine'),
    grus: pattern('Grulla', 'la Grulla', 'feminine'),
    'piscis-austrinus': pattern('Pez Austral', 'Fomalhaut y el Pez Austral', 'plural-masculine'),
    'achernar-hydrus': pattern('Achernar e Hidra Macho', 'Achernar y el triángulo de la Hidra Macho', 'plural-masculine'),
    gemini: pattern('Géminis', 'Géminis', 'masculine', undefined, {
      heads: ['las cabezas de Géminis', 'plural-feminine'],
      feet: ['los pies de los gemelos de Géminis', 'plural-masculine'],
    }),
    corvus: pattern('Cuervo', 'el Cuervo', 'masculine'),
    bootes: pattern('Cometa del Boyero', 'la Cometa del Boyero', 'feminine'),
    'corona-borealis': pattern('Corona Boreal', 'la Corona Boreal', 'feminine'),
    hercules: pattern('Hércules', 'Hércules', 'masculine', undefined, { Keystone: ['la Piedra Angular de Hércules', 'feminine'] }),
    delphinus: pattern('Delfín', 'el Delfín', 'masculine'),
    'canis-major': pattern('Can Mayor', 'el Can Mayor', 'masculine'),
    'canis-minor': pattern('Can Menor', 'el Can Menor', 'masculine'),
    virgo: pattern('Virgo', 'Virgo', 'feminine'),
    libra: pattern('Libra', 'Libra', 'feminine'),
    aries: pattern('Aries', 'Aries', 'masculine'),
    cepheus: pattern('Cefeo', 'Cefeo', 'masculine'),
    'draco-head': pattern('Cabeza del Dragón', 'la cabeza del Dragón', 'feminine'),
    ophiuchus: pattern('Ofiuco', 'Ofiuco', 'masculine'),
    lepus: pattern('Liebre', 'la Liebre', 'feminine'),
    hydra: pattern('Cabeza de la Hidra', 'la cabeza de la Hidra', 'feminine'),
    circlet: pattern('Anillo de Piscis', 'el Anillo de Piscis', 'masculine'),
  },
  bodies: {
    // Meteor showers by IAU code (common usage, from memory).
    'shower:QUA': body('Cuadrántidas', 'las Cuadrántidas', 'plural-feminine'),
    'shower:LYR': body('Líridas', 'las Líridas', 'plural-feminine'),
    'shower:ETA': body('eta Acuáridas', 'las eta Acuáridas', 'plural-feminine'),
    'shower:SDA': body('delta Acuáridas del Sur', 'las delta Acuáridas del Sur', 'plural-feminine'),
    'shower:PER': body('Perseidas', 'las Perseidas', 'plural-feminine'),
    'shower:DRA': body('Dracónidas', 'las Dracónidas', 'plural-feminine'),
    'shower:ORI': body('Oriónidas', 'las Oriónidas', 'plural-feminine'),
    'shower:LEO': body('Leónidas', 'las Leónidas', 'plural-feminine'),
    'shower:GEM': body('Gemínidas', 'las Gemínidas', 'plural-feminine'),
    'shower:URS': body('Úrsidas', 'las Úrsidas', 'plural-feminine'),
    sun: body('Sol', 'el Sol', 'masculine'),
    moon: body('Luna', 'la Luna', 'feminine'),
    mercury: body('Mercurio', 'Mercurio', 'masculine'),
    venus: body('Venus', 'Venus', 'masculine'),
    mars: body('Marte', 'Marte', 'masculine'),
    jupiter: body('Júpiter', 'Júpiter', 'masculine'),
    saturn: body('Saturno', 'Saturno', 'masculine'),
    uranus: body('Urano', 'Urano', 'masculine'),
    neptune: body('Neptuno', 'Neptuno', 'masculine'),
  },
};
