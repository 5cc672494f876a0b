/**
 * French names of the star patterns and bodies. Constellations by their French names (le Lion,
 * la Croix du Sud); asterisms as French amateurs call them (la Grande Casserole, le W de
 * Cassiopée, le Triangle d'été, la Croix du Cygne). IAU proper names of stars stay as they are
 * (Polaris, Arcturus, Spica). Source: common usage, from memory.
 */
import { body, pattern, type LanguageNames } from './types.ts';

export const fr: LanguageNames = {
  source: 'common usage, from memory',
  patterns: {
    'big-dipper': pattern('Grande Casserole', 'la Grande Casserole', 'feminine', undefined, {
      bowl: ['la cuve de la Grande Casserole', 'feminine'],
      handle: ['le manche de la Grande Casserole', 'masculine'],
      Pointers: ['les deux étoiles de l’avant de la Grande Casserole', 'plural-feminine'],
    }),
    'little-dipper': pattern('Petite Casserole', 'la Petite Casserole', 'feminine', undefined, {
      bowl: ['la cuve de la Petite Casserole', 'feminine'],
      handle: ['le manche de la Petite Casserole, qui se termine sur Polaris', 'masculine'],
    }),
    cassiopeia: pattern('W de Cassiopée', 'le W de Cassiopée', 'masculine'),
    'summer-triangle': pattern('Triangle d’été', 'le Triangle d’été', 'masculine'),
    'great-square': pattern('Grand Carré de Pégase', 'le Grand Carré de Pégase', 'masculine'),
    orion: pattern('Orion', 'Orion', 'masculine', undefined, {
      belt: ['la Ceinture d’Orion', 'feminine'],
      shoulders: ['les épaules d’Orion (Betelgeuse et Bellatrix)', 'plural-feminine'],
      feet: ['les pieds d’Orion (Rigel et Saiph)', 'plural-masculine'],
      sword: ['l’Épée d’Orion', 'feminine'],
    }),
    leo: pattern('Lion', 'le Lion', 'masculine', undefined, {
      Sickle: ['la Faucille du Lion', 'feminine'],
      hindquarters: ['le triangle de l’arrière-train du Lion', 'masculine'],
    }),
    teapot: pattern('Théière', 'la Théière du Sagittaire', 'feminine', undefined, {
      spout: ['le bec de la Théière', 'masculine'],
      lid: ['le couvercle de la Théière', 'masculine'],
      handle: ['l’anse de la Théière', 'feminine'],
    }),
    'southern-cross': pattern('Croix du Sud', 'la Croix du Sud', 'feminine'),
    centaurus: pattern('Centaure', 'le Centaure', 'masculine', undefined, { Pointers: ['les Pointeurs (Alpha et Bêta du Centaure)', 'plural-masculine'] }),
    pleiades: pattern('Pléiades', 'les Pléiades', 'plural-feminine'),
    taurus: pattern('Taureau', 'le Taureau', 'masculine', undefined, {
      V: ['le V des Hyades dans le Taureau', 'masculine'],
      horns: ['les cornes du Taureau', 'plural-feminine'],
    }),
    scorpius: pattern('Scorpion', 'le Scorpion', 'masculine', undefined, {
      head: ['la tête du Scorpion', 'feminine'],
      heart: ['le cœur du Scorpion', 'masculine'],
      curve: ['la queue recourbée du Scorpion', 'feminine'],
      sting: ['le dard du Scorpion', 'masculine'],
    }),
    'winter-hexagon': pattern('Hexagone d’hiver', 'l’Hexagone d’hiver', 'masculine'),
    'winter-triangle': pattern('Triangle d’hiver', 'le Triangle d’hiver', 'masculine'),
    'spring-triangle': pattern('Triangle du printemps', 'le Triangle du printemps', 'masculine'),
    'spring-arc': pattern('Arc du printemps', 'l’arc qui va du manche de la Grande Casserole à Arcturus et Spica', 'masculine'),
    'northern-cross': pattern('Croix du Cygne', 'la Croix du Cygne', 'feminine', undefined, {
      upright: ['la grande branche de la Croix du Cygne (de Deneb à Albireo)', 'feminine'],
      crossbar: ['la traverse de la Croix du Cygne', 'feminine'],
    }),
    lyra: pattern('Lyre', 'la Lyre', 'feminine', undefined, { parallelogram: ['le petit parallélogramme de la Lyre', 'masculine'] }),
    aquila: pattern('Aigle', 'l’Aigle', 'masculine'),
    auriga: pattern('Cocher', 'le Cocher', 'masculine', undefined, {
      pentagon: ['le pentagone du Cocher', 'masculine'],
      Kids: ['les Chevreaux, le petit triangle à côté de Capella', 'plural-masculine'],
    }),
    perseus: pattern('Persée', 'Persée', 'masculine'),
    andromeda: pattern('Andromède', 'Andromède', 'feminine', undefined, { chain: ['la chaîne d’Andromède', 'feminine'] }),
    capricornus: pattern('Capricorne', 'le Capricorne', 'masculine'),
    carina: pattern('Canopus et la Carène', 'Canopus et la Carène', 'plural-masculine'),
    'false-cross': pattern('Fausse Croix', 'la Fausse Croix', 'feminine'),
    'triangulum-australe': pattern('Triangle austral', 'le Triangle austral', 'masculine'),
    grus: pattern('Grue', 'la Grue', 'feminine'),
    'piscis-austrinus': pattern('Poisson austral', 'Fomalhaut et le Poisson austral', 'plural-masculine'),
    'achernar-hydrus': pattern('Achernar et l’Hydre mâle', 'Achernar et le triangle de l’Hydre mâle', 'plural-masculine'),
    gemini: pattern('Gémeaux', 'les Gémeaux', 'plural-masculine', undefined, {
      heads: ['les têtes des Gémeaux', 'plural-feminine'],
      feet: ['les pieds des Gémeaux', 'plural-masculine'],
    }),
    corvus: pattern('Corbeau', 'le Corbeau', 'masculine'),
    bootes: pattern('Cerf-volant du Bouvier', 'le Cerf-volant du Bouvier', 'masculine'),
    'corona-borealis': pattern('Couronne boréale', 'la Couronne boréale', 'feminine'),
    hercules: pattern('Hercule', 'Hercule', 'masculine', undefined, { Keystone: ['la Clé de voûte d’Hercule', 'feminine'] }),
    delphinus: pattern('Dauphin', 'le Dauphin', 'masculine'),
    'canis-major': pattern('Grand Chien', 'le Grand Chien', 'masculine'),
    'canis-minor': pattern('Petit Chien', 'le Petit Chien', 'masculine'),
    virgo: pattern('Vierge', 'la Vierge', 'feminine'),
    libra: pattern('Balance', 'la Balance', 'feminine'),
    aries: pattern('Bélier', 'le Bélier', 'masculine'),
    cepheus: pattern('Céphée', 'Céphée', 'masculine'),
    'draco-head': pattern('Tête du Dragon', 'la tête du Dragon', 'feminine'),
    ophiuchus: pattern('Ophiuchus', 'Ophiuchus', 'masculine'),
    lepus: pattern('Lièvre', 'le Lièvre', 'masculine'),
    hydra: pattern('Tête de l’Hydre', 'la tête de l’Hydre', 'feminine'),
    circlet: pattern('Cercle des Poissons', 'le Cercle des Poissons', 'masculine'),
  },
  bodies: {
    sun: body('Soleil', 'le Soleil', 'masculine'),
    moon: body('Lune', 'la Lune', 'feminine'),
    mercury: body('Mercure', 'Mercure', 'masculine'),
    venus: body('Vénus', 'Vénus', 'feminine'),
    mars: body('Mars', 'Mars', 'masculine'),
    jupiter: body('Jupiter', 'Jupiter', 'masculine'),
    saturn: body('Saturne', 'Saturne', 'masculine'),
    uranus: body('Uranus', 'Uranus', 'masculine'),
    neptune: body('Neptune', 'Neptune', 'masculine'),
  },
};
