import { PreservingError } from './errors';

/**
 * Pickled products with their published boiling-water processing tables.
 *
 * Source of every table: USDA, *Complete Guide to Home Canning*, Agriculture Information Bulletin
 * No. 539, revised 2015, Guide 6 ("Preparing and Canning Fermented Foods and Pickled Vegetables").
 * `confidence` says how each row was checked from here:
 * - 'verified': read in a verbatim reproduction of the guide's table (1994 edition reproductions and
 *   the National Center for Home Food Preservation pages that carry the 2009/2015 text);
 * - 'secondary': read only on a secondary page quoting the National Center for Home Food Preservation;
 * - 'memory': from memory, not confirmed; shown and tested as such.
 */

export const PRODUCT_IDS = [
  'fresh-pack-dill-pickles',
  'bread-and-butter-pickles',
  'pickle-relish',
  'dilly-beans',
  'pickled-beets',
  'pickled-hot-peppers',
  'fermented-dill-pickles',
] as const;
export type ProductId = (typeof PRODUCT_IDS)[number];

export const JAR_SIZES = ['half-pint', 'pint', 'quart'] as const;
export type JarSize = (typeof JAR_SIZES)[number];

export const JAR_LABELS: Record<JarSize, string> = {
  'half-pint': 'half-pint (8 fl oz, 237 mL)',
  pint: 'pint (16 fl oz, 473 mL)',
  quart: 'quart (32 fl oz, 946 mL)',
};

export type AltitudeBand = { fromFt: number; toFt: number | null };

/** The three altitude bands of most Guide 6 pickle tables. The top band is "above 6,000 ft"; the
 * guide's altitude advice stops at 10,000 ft, so Brinewright answers nothing above that. */
export const ALTITUDE_BANDS: readonly AltitudeBand[] = [
  { fromFt: 0, toFt: 1000 },
  { fromFt: 1001, toFt: 6000 },
  { fromFt: 6001, toFt: 10000 },
];
/** The four bands some Guide 6 tables use (pickled beets): 0–1,000; 1,001–3,000; 3,001–6,000; above 6,000 ft. */
export const FOUR_ALTITUDE_BANDS: readonly AltitudeBand[] = [
  { fromFt: 0, toFt: 1000 },
  { fromFt: 1001, toFt: 3000 },
  { fromFt: 3001, toFt: 6000 },
  { fromFt: 6001, toFt: 10000 },
];
export const MAX_TABLE_ALTITUDE_FT = 10000;

/** Minutes for the product's bands in order, lowest altitude first. */
export type BandMinutes = readonly number[];

export type Confidence = 'verified' | 'secondary' | 'memory';

export type Product = {
  id: ProductId;
  name: string;
  pack: 'raw' | 'hot';
  jars: readonly JarSize[];
  headspaceIn: number;
  /** The altitude bands of the product's table. */
  bands: readonly AltitudeBand[];
  /** Boiling-water minutes per jar size, one per band. */
  times: Partial<Record<JarSize, BandMinutes>>;
  source: string;
  confidence: Confidence;
  /** Where the guide allows 180–185 °F for 30 minutes instead of the boiling-water time. */
  lowTemperaturePasteurization?: boolean;
  /** The pickling liquid of the product's tested recipe. */
  testedLiquid: TestedLiquid;
};

/**
 * The liquid poured over the produce in a tested recipe, in US cups as the recipe gives it.
 * Dissolved sugar is NOT counted in the liquid's volume (`sugarCountsInVolume: false`): the recipes
 * give sugar by dry measure and the learner's batch is entered as vinegar and water only, so the
 * comparison is like for like; counting the sugar's volume would only lower the floor.
 */
export type TestedLiquid = {
  vinegarCups: number;
  vinegarAcidityPct: number;
  waterCups: number;
  /** Sugar dissolved in the liquid, dry US cups (not counted in the volume). */
  sugarCups?: number;
  /** Another liquid counted in the volume (none of the Guide 6 recipes here has one). */
  other?: { name: string; cups: number };
  /** Canning or pickling salt in the liquid, dry US cups (fermented pickles: the brine's salt). */
  saltCups?: number;
  sugarCountsInVolume: false;
  source: string;
  confidence: Confidence;
};

const GUIDE6 = 'USDA Complete Guide to Home Canning (AIB 539, rev. 2015), Guide 6';

const liquid = (l: Omit<TestedLiquid, 'vinegarAcidityPct' | 'sugarCountsInVolume'>): TestedLiquid => ({
  vinegarAcidityPct: 5,
  sugarCountsInVolume: false,
  ...l,
});

export const PRODUCTS: Record<ProductId, Product> = {
  'fresh-pack-dill-pickles': {
    id: 'fresh-pack-dill-pickles',
    name: 'Quick fresh-pack dill pickles',
    pack: 'raw',
    jars: ['pint', 'quart'],
    headspaceIn: 0.5,
    bands: ALTITUDE_BANDS,
    times: { pint: [10, 15, 20], quart: [15, 20, 25] },
    source: `${GUIDE6}, "Quick fresh-pack dill pickles", recommended process time table`,
    confidence: 'verified',
    lowTemperaturePasteurization: true,
    // 1 1/2 qt vinegar (5 %), 2 qt water, 1/2 cup salt, 1/4 cup sugar (Guide 6:20 as reproduced by
    // Michigan State University Extension, 1997, from the 1994 edition).
    testedLiquid: liquid({
      vinegarCups: 6,
      waterCups: 8,
      sugarCups: 0.25,
      saltCups: 0.5,
      source: `${GUIDE6}, "Quick fresh-pack dill pickles": 1 1/2 qt vinegar (5 %), 2 qt water, 1/4 cup sugar, 1/2 cup salt`,
      confidence: 'verified',
    }),
  },
  'bread-and-butter-pickles': {
    id: 'bread-and-butter-pickles',
    name: 'Bread-and-butter pickles',
    pack: 'hot',
    jars: ['pint', 'quart'],
    headspaceIn: 0.5,
    bands: ALTITUDE_BANDS,
    times: { pint: [10, 15, 20], quart: [10, 15, 20] },
    source: `${GUIDE6}, "Bread-and-butter pickles", recommended process time table`,
    confidence: 'verified',
    lowTemperaturePasteurization: true,
    // 4 cups vinegar (5 %), 4 1/2 cups sugar, no water (Guide 6:19, Michigan State University Extension reproduction).
    testedLiquid: liquid({
      vinegarCups: 4,
      waterCups: 0,
      sugarCups: 4.5,
      source: `${GUIDE6}, "Bread-and-butter pickles": 4 cups vinegar (5 %), 4 1/2 cups sugar, no water`,
      confidence: 'verified',
    }),
  },
  'pickle-relish': {
    id: 'pickle-relish',
    name: 'Pickle relish',
    pack: 'hot',
    jars: ['half-pint', 'pint'],
    headspaceIn: 0.5,
    bands: ALTITUDE_BANDS,
    times: { 'half-pint': [10, 15, 20], pint: [10, 15, 20] },
    source: `${GUIDE6}, "Pickle relish", recommended process time table`,
    confidence: 'verified',
    testedLiquid: liquid({
      vinegarCups: 6,
      waterCups: 0,
      sugarCups: 2,
      source: `${GUIDE6}, "Pickle relish": 6 cups white vinegar (5 %), 2 cups sugar, no water (from memory; the batch planner's recipe has the same)`,
      confidence: 'memory',
    }),
  },
  'dilly-beans': {
    id: 'dilly-beans',
    name: 'Pickled dilly beans',
    pack: 'raw',
    jars: ['pint'],
    headspaceIn: 0.5,
    bands: ALTITUDE_BANDS,
    times: { pint: [5, 10, 15] },
    source: `${GUIDE6}, "Pickled dilly beans", recommended process time table`,
    confidence: 'secondary',
    // Equal parts vinegar and water: So Easy to Preserve, 6th ed., as reproduced by University of
    // Minnesota Extension (2 1/2 cups each, read there); Guide 6's own version has 4 cups each (from
    // memory, also on secondary pages). The batch planner scales the same recipe.
    testedLiquid: liquid({
      vinegarCups: 2.5,
      waterCups: 2.5,
      saltCups: 0.25,
      source:
        'So Easy to Preserve, 6th ed. (University of Georgia Extension, 2014), "Pickled dilly beans": 2 1/2 cups white vinegar (5 %), 2 1/2 cups water, as reproduced by University of Minnesota Extension',
      confidence: 'secondary',
    }),
  },
  'pickled-beets': {
    id: 'pickled-beets',
    name: 'Pickled beets',
    pack: 'hot',
    jars: ['pint', 'quart'],
    headspaceIn: 0.5,
    bands: FOUR_ALTITUDE_BANDS,
    times: { pint: [30, 35, 40, 45], quart: [30, 35, 40, 45] },
    // Two reproductions of the table were read: both give 30 / 40 / 45; one gives 35 at
    // 1,001–3,000 ft, the other prints 45 there, out of order with the rest (a misprint, taken as 35).
    source: `${GUIDE6}, "Pickled beets", recommended process time table (four altitude bands)`,
    confidence: 'secondary',
    testedLiquid: liquid({
      vinegarCups: 4,
      waterCups: 2,
      sugarCups: 2,
      source: `${GUIDE6}, "Pickled beets": 4 cups vinegar (5 %), 2 cups water, 2 cups sugar (from memory, not confirmed here)`,
      confidence: 'memory',
    }),
  },
  'pickled-hot-peppers': {
    id: 'pickled-hot-peppers',
    name: 'Pickled hot peppers',
    pack: 'raw',
    jars: ['half-pint', 'pint'],
    headspaceIn: 0.5,
    bands: ALTITUDE_BANDS,
    times: { 'half-pint': [10, 15, 20], pint: [10, 15, 20] },
    source: `${GUIDE6}, "Pickled hot peppers", recommended process time table`,
    confidence: 'verified',
    testedLiquid: liquid({
      vinegarCups: 5,
      waterCups: 1,
      sugarCups: 0.125,
      source: `${GUIDE6}, "Pickled hot peppers": 5 cups vinegar (5 %), 1 cup water, 2 tbsp sugar (read on secondary pages quoting the National Center for Home Food Preservation)`,
      confidence: 'secondary',
    }),
  },
  'fermented-dill-pickles': {
    id: 'fermented-dill-pickles',
    name: 'Dill pickles (fermented, then canned)',
    pack: 'raw',
    jars: ['pint', 'quart'],
    headspaceIn: 0.5,
    bands: ALTITUDE_BANDS,
    times: { pint: [10, 15, 20], quart: [15, 20, 25] },
    source: `${GUIDE6}, "Dill pickles" (fermented), recommended process time table`,
    confidence: 'verified',
    lowTemperaturePasteurization: true,
    // Per gallon of crock: 1/2 cup salt, 1/4 cup vinegar (5 %), 8 cups water. Its acid comes from the
    // fermentation, so the check that fits it is the brine's salt by weight (BRINE_BY_WEIGHT below).
    testedLiquid: liquid({
      vinegarCups: 0.25,
      waterCups: 8,
      saltCups: 0.5,
      source: `${GUIDE6}, "Dill pickles" (fermented): per gallon, 1/2 cup salt, 1/4 cup vinegar (5 %), 8 cups water`,
      confidence: 'verified',
    }),
  },
};

export const isProductId = (value: unknown): value is ProductId => typeof value === 'string' && (PRODUCT_IDS as readonly string[]).includes(value);

/** An unknown id as quoted back in a message: printable, at most 40 characters. */
const shown = (id: string) => {
  const chars = Array.from(id.replace(/[\p{Cc}\p{Cs}\p{Cf}]/gu, '\uFFFD'));
  return chars.length > 40 ? chars.slice(0, 39).join('') + '…' : chars.join('');
};

/** The product, or PreservingError not-found (HTTP 404). */
export function getProduct(id: string): Product {
  if (!isProductId(id)) {
    throw new PreservingError('not-found', `There is no product called "${shown(String(id))}". Choose one of: ${PRODUCT_IDS.join(', ')}.`, 'product');
  }
  return PRODUCTS[id];
}

/** Options for a product picker: id and plain name. */
export const PRODUCT_OPTIONS = PRODUCT_IDS.map((id) => ({ value: id, label: PRODUCTS[id].name }));

/** A tested liquid's acetic acid in g per 100 mL: vinegar acid over vinegar + water + other liquid
 * (the volumes are all in cups, so the unit cancels; dissolved sugar not counted, see TestedLiquid). */
export function testedAceticAcidPct(l: TestedLiquid): number {
  return (l.vinegarCups * l.vinegarAcidityPct) / (l.vinegarCups + l.waterCups + (l.other?.cups ?? 0));
}

/** Products whose acid comes from the vinegar of their tested liquid (fermented pickles make their own). */
export const VINEGAR_PICKLED_IDS = PRODUCT_IDS.filter((id) => id !== 'fermented-dill-pickles');

/** The weakest tested vinegar liquid in the product table (quick fresh-pack dill pickles, 6 : 8). */
export const WEAKEST_TESTED = VINEGAR_PICKLED_IDS.map((id) => ({
  product: PRODUCTS[id],
  aceticAcidPct: testedAceticAcidPct(PRODUCTS[id].testedLiquid),
})).reduce((a, b) => (b.aceticAcidPct < a.aceticAcidPct ? b : a));
