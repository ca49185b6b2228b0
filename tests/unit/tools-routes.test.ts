import { describe, expect, it } from 'vitest';
import { GET as batch } from '@/app/api/tools/batch/route';
import { GET as boilingPoint } from '@/app/api/tools/boiling-point/route';
import { GET as brine } from '@/app/api/tools/brine/route';
import { GET as convert } from '@/app/api/tools/convert/route';
import { GET as crisping } from '@/app/api/tools/crisping/route';
import { GET as headspace } from '@/app/api/tools/headspace/route';
import { GET as pressure } from '@/app/api/tools/pressure/route';
import { GET as processingTime } from '@/app/api/tools/processing-time/route';
import { GET as salt } from '@/app/api/tools/salt/route';
import { GET as sugar } from '@/app/api/tools/sugar/route';
import { LOCAL_GUIDANCE, mlPer } from '@/lib/preserving';

type Handler = (request: Request, context: unknown) => Promise<Response>;

/** Calls a route handler directly, as Next would, and returns status and JSON. */
async function call(handler: Handler, path: string, query: Record<string, string | number>) {
  const url = new URL(`http://127.0.0.1/api/tools/${path}`);
  for (const [key, value] of Object.entries(query)) url.searchParams.set(key, String(value));
  const response = await handler(new Request(url), {});
  expect(response.headers.get('content-type')).toContain('application/json');
  return { status: response.status, body: (await response.json()) as Record<string, unknown> };
}

/** A 400 answer must name the parameter, both in `fields` and in the message. */
async function expect400(handler: Handler, path: string, query: Record<string, string | number>, param: string, message?: string) {
  const { status, body } = await call(handler, path, query);
  expect(status).toBe(400);
  expect(body.error).toBe('bad_request');
  expect(Object.keys(body.fields as object)).toContain(param);
  expect(body.message).toContain(param);
  if (message) expect((body.fields as Record<string, string[]>)[param]).toEqual([message]);
  return body;
}

async function expect422(handler: Handler, path: string, query: Record<string, string | number>, param: string) {
  const { status, body } = await call(handler, path, query);
  expect(status).toBe(422);
  expect(body.error).toBe('unprocessable');
  expect(body.param).toBe(param);
  expect(body.message).toContain(LOCAL_GUIDANCE);
  return body;
}

describe('GET /api/tools/processing-time', () => {
  it('answers the USDA Guide 6 minutes with method, band and source', async () => {
    // USDA Complete Guide to Home Canning, rev. 2015, Guide 6, quick fresh-pack dill pickles: quarts
    // 15 / 20 / 25 min at 0–1,000 / 1,001–6,000 / above 6,000 ft.
    const { status, body } = await call(processingTime, 'processing-time', { product: 'fresh-pack-dill-pickles', jar: 'quart', altitudeFt: 7200 });
    expect(status).toBe(200);
    expect(body).toMatchObject({
      minutes: 25,
      method: 'boiling-water',
      altitudeBand: { fromFt: 6001, toFt: 10000 },
      lowTemperaturePasteurization: { waterTempF: [180, 185], minutes: 30 },
    });
    expect(body.source).toContain('Complete Guide to Home Canning');
    const dilly = (await call(processingTime, 'processing-time', { product: 'dilly-beans', jar: 'pint', altitudeFt: 0 })).body;
    expect(dilly.minutes).toBe(5);
    // Under 10 minutes: sterilised jars, 10 minutes' boil up to 1,000 ft (USDA Complete Guide, Guide 1).
    expect(dilly.sterilizeJars).toMatchObject({ boilMinutes: 10, source: expect.stringContaining('Sterilization of empty jars') });
    // Metres: 2,000 m = 6,562 ft, above 6,000 ft; below sea level the lowest band.
    expect((await call(processingTime, 'processing-time', { product: 'fresh-pack-dill-pickles', jar: 'quart', altitudeM: 2000 })).body.minutes).toBe(25);
    expect((await call(processingTime, 'processing-time', { product: 'fresh-pack-dill-pickles', jar: 'quart', altitudeM: -86 })).body.minutes).toBe(15);
  });

  it('answers 400 for a missing, non-numeric or negative altitude, naming it', async () => {
    await expect400(processingTime, 'processing-time', { product: 'dilly-beans', jar: 'pint' }, 'altitudeFt', 'Enter the altitude in feet as a number.');
    await expect400(processingTime, 'processing-time', { product: 'dilly-beans', jar: 'pint', altitudeFt: 'high' }, 'altitudeFt');
    await expect400(
      processingTime,
      'processing-time',
      { product: 'dilly-beans', jar: 'pint', altitudeFt: -2000 },
      'altitudeFt',
      'The altitude in feet must be at least -1,500.',
    );
    await expect400(
      processingTime,
      'processing-time',
      { product: 'dilly-beans', jar: 'pint', altitudeM: -500 },
      'altitudeM',
      'The altitude in metres must be at least -457.',
    );
    // Feet and metres together are refused rather than one silently winning.
    await expect400(
      processingTime,
      'processing-time',
      { product: 'dilly-beans', jar: 'pint', altitudeFt: 100, altitudeM: 30 },
      'altitudeFt',
      'Give the altitude once: altitudeFt in feet, or altitudeM in metres.',
    );
    await expect400(processingTime, 'processing-time', { product: 'dilly-beans', jar: 'jug', altitudeFt: 0 }, 'jar');
    await expect400(processingTime, 'processing-time', { jar: 'pint', altitudeFt: 0 }, 'product');
  });

  it('answers 404 for an unknown product', async () => {
    const { status, body } = await call(processingTime, 'processing-time', { product: 'pickled-okra', jar: 'pint', altitudeFt: 0 });
    expect(status).toBe(404);
    expect(body).toMatchObject({ error: 'not_found', param: 'product' });
  });

  it('answers 422 for a jar the table does not cover and above 10,000 ft', async () => {
    await expect422(processingTime, 'processing-time', { product: 'dilly-beans', jar: 'quart', altitudeFt: 0 }, 'jar');
    await expect422(processingTime, 'processing-time', { product: 'dilly-beans', jar: 'pint', altitudeFt: 10001 }, 'altitudeFt');
  });
});

describe('GET /api/tools/pressure', () => {
  it('answers pounds by gauge and altitude', async () => {
    // USDA Complete Guide, rev. 2015, Guide 4 tables: dial 13 lb at 4,001–6,000 ft; weighted 15 lb above 1,000 ft.
    expect((await call(pressure, 'pressure', { gauge: 'dial', altitudeFt: 5000 })).body).toMatchObject({
      pounds: 13,
      source: expect.stringContaining('Guide 4'),
    });
    expect((await call(pressure, 'pressure', { gauge: 'weighted', altitudeFt: 1200 })).body.pounds).toBe(15);
  });

  it('answers 400 and 422', async () => {
    await expect400(pressure, 'pressure', { gauge: 'spring', altitudeFt: 0 }, 'gauge', 'Choose a gauge type: weighted, dial.');
    await expect400(pressure, 'pressure', { gauge: 'dial' }, 'altitudeFt');
    await expect422(pressure, 'pressure', { gauge: 'dial', altitudeFt: 12000 }, 'altitudeFt');
  });
});

describe('GET /api/tools/boiling-point', () => {
  it('answers °F and °C (published table: 203 °F at 5,000 ft, ±0.2)', async () => {
    const { status, body } = await call(boilingPoint, 'boiling-point', { altitudeFt: 5000 });
    expect(status).toBe(200);
    expect(Math.abs((body.fahrenheit as number) - 203)).toBeLessThan(0.2);
    expect(body.celsius as number).toBeCloseTo(94.9, 1);
  });

  it('answers 400 for bad altitudes and 422 above the model', async () => {
    await expect400(boilingPoint, 'boiling-point', { altitudeFt: '' }, 'altitudeFt');
    await expect400(boilingPoint, 'boiling-point', { altitudeFt: -1501 }, 'altitudeFt');
    await expect400(boilingPoint, 'boiling-point', { altitudeM: 'high' }, 'altitudeM');
    await expect422(boilingPoint, 'boiling-point', { altitudeFt: 50000 }, 'altitudeFt');
  });
});

describe('GET /api/tools/headspace', () => {
  it('answers the recommendation alone, and with a measurement the verdict and why', async () => {
    // USDA Guide 6 procedures: 1/2-inch headspace for pickles.
    expect((await call(headspace, 'headspace', { product: 'pickled-hot-peppers' })).body).toEqual({ recommendedIn: 0.5, source: expect.any(String) });
    const { body } = await call(headspace, 'headspace', { product: 'pickled-hot-peppers', measuredIn: '1/4' });
    expect(body).toMatchObject({ recommendedIn: 0.5, verdict: 'too-little', why: expect.stringContaining('seal') });
    expect((await call(headspace, 'headspace', { product: 'pickled-hot-peppers', measuredIn: 0.5 })).body.verdict).toBe('ok');
    expect((await call(headspace, 'headspace', { product: 'pickled-hot-peppers', measuredIn: 1 })).body.verdict).toBe('too-much');
  });

  it('answers 400 and 404', async () => {
    await expect400(headspace, 'headspace', { product: 'pickle-relish', measuredIn: 'a bit' }, 'measuredIn');
    expect((await call(headspace, 'headspace', { product: 'salsa' })).status).toBe(404);
  });
});

describe('GET /api/tools/brine', () => {
  it('answers acid %, share, pH and warnings; with produce the equilibrated acidity', async () => {
    // Quick fresh-pack dill solution of USDA Guide 6 (6 cups 5 % vinegar, 8 cups water): computed 2.14 %, pH 2.603.
    const { status, body } = await call(brine, 'brine', { vinegarMl: 6 * mlPer('cup'), vinegarAcidityPct: 5, waterMl: 8 * mlPer('cup') });
    expect(status).toBe(200);
    expect(body.aceticAcidPct as number).toBeCloseTo(2.1429, 4);
    expect(body.vinegarShare as number).toBeCloseTo(0.4286, 4);
    expect(body.estimatedPh as number).toBeCloseTo(2.603, 3);
    expect(body.warnings).toEqual([]);
    expect(body).not.toHaveProperty('equilibratedAcidityPct');
    const withProduce = await call(brine, 'brine', { vinegarMl: 500, vinegarAcidityPct: 5, waterMl: 500, otherMl: 0, produceG: 1000, produceWaterPct: 95 });
    expect(withProduce.body.equilibratedAcidityPct as number).toBeCloseTo((25 / 1950) * 100, 9);
    expect((withProduce.body.warnings as string[]).length).toBe(1);
    expect(withProduce.body).not.toHaveProperty('equilibratedPh');
    expect(withProduce.body.phCaution).toMatch(/before the produce goes in/);
  });

  it("compares with a chosen product's tested liquid, and answers 404 for an unknown product", async () => {
    // USDA Guide 6, pickled hot peppers: 5 cups vinegar (5 %), 1 cup water → 4.17 %; 1 : 1 (2.5 %) warns.
    const { status, body } = await call(brine, 'brine', { vinegarMl: 500, vinegarAcidityPct: 5, waterMl: 500, product: 'pickled-hot-peppers' });
    expect(status).toBe(200);
    expect(body).toMatchObject({ belowTested: true, tested: { product: 'pickled-hot-peppers', aceticAcidPct: expect.closeTo(4.1667, 4), weakest: false } });
    expect((body.warnings as string[]).join(' ')).toMatch(/weaker than the tested liquid of pickled hot peppers \(4.17%\)/);
    // An empty product is "not given": the weakest tested liquid (2.14 %), which 2.5 % is not below.
    expect((await call(brine, 'brine', { vinegarMl: 500, vinegarAcidityPct: 5, waterMl: 500, product: '' })).body).toMatchObject({
      belowTested: false,
      tested: { weakest: true },
    });
    const unknown = await call(brine, 'brine', { vinegarMl: 500, vinegarAcidityPct: 5, waterMl: 500, product: 'pickled-okra' });
    expect(unknown.status).toBe(404);
    expect(unknown.body).toMatchObject({ error: 'not_found', param: 'product' });
  });

  it('answers 400 naming the parameter', async () => {
    await expect400(brine, 'brine', { vinegarAcidityPct: 5, waterMl: 500 }, 'vinegarMl');
    await expect400(brine, 'brine', { vinegarMl: 500, vinegarAcidityPct: 'five', waterMl: 500 }, 'vinegarAcidityPct');
    await expect400(brine, 'brine', { vinegarMl: 500, vinegarAcidityPct: 5, waterMl: 500, produceG: -4 }, 'produceG');
    await expect400(brine, 'brine', { vinegarMl: 0, vinegarAcidityPct: 5, waterMl: 0 }, 'vinegarMl');
  });
});

describe('GET /api/tools/sugar', () => {
  it('answers grams and the syrup share by weight (USDA FoodData Central SR Legacy, 1 cup granulated = 200 g; from memory)', async () => {
    const { body } = await call(sugar, 'sugar', { sugar: 'granulated', amount: 2, unit: 'cup', liquidMl: 400 });
    expect(body).toMatchObject({ grams: 400, gPerCup: 200, why: expect.any(String) });
    expect(body.syrupPct as number).toBeCloseTo(50, 9);
    const plain = (await call(sugar, 'sugar', { sugar: 'brown-packed', amount: 100, unit: 'g' })).body;
    expect(plain).toMatchObject({ grams: 100 });
    expect(plain).not.toHaveProperty('syrupPct');
  });

  it('answers 400 naming the parameter', async () => {
    await expect400(sugar, 'sugar', { sugar: 'maple', amount: 1, unit: 'cup' }, 'sugar');
    await expect400(sugar, 'sugar', { sugar: 'granulated', amount: 'lots', unit: 'cup' }, 'amount');
    await expect400(sugar, 'sugar', { sugar: 'granulated', amount: 1, unit: 'm' }, 'unit');
    await expect400(sugar, 'sugar', { sugar: 'granulated', amount: 1, unit: 'cup', liquidMl: -5 }, 'liquidMl');
  });
});

describe('GET /api/tools/salt', () => {
  it('answers grams, brine % and suitability', async () => {
    const { body } = await call(salt, 'salt', { salt: 'canning', amount: 0.5, unit: 'cup', waterMl: 1000 });
    expect(body).toMatchObject({ grams: 144, suitable: true, why: expect.any(String) });
    expect(body.brinePct as number).toBeCloseTo((144 / 1144) * 100, 9);
    const table = (await call(salt, 'salt', { salt: 'table', amount: 10, unit: 'g' })).body;
    expect(table).toMatchObject({ grams: 10, suitable: false });
    expect(table).not.toHaveProperty('brinePct');
  });

  it('answers 400 naming the parameter', async () => {
    await expect400(salt, 'salt', { salt: 'rock', amount: 1, unit: 'tsp' }, 'salt');
    await expect400(salt, 'salt', { salt: 'table', amount: -1, unit: 'tsp' }, 'amount');
    await expect400(salt, 'salt', { salt: 'table', amount: 1, unit: 'ft' }, 'unit');
    await expect400(salt, 'salt', { salt: 'table', amount: 1 }, 'unit');
  });
});

describe('GET /api/tools/crisping', () => {
  it('answers calcium chloride doses and the lime schedule, with cautions', async () => {
    const cacl = (await call(crisping, 'crisping', { agent: 'calcium-chloride', jar: 'quart', jars: 7 })).body;
    expect(cacl).toMatchObject({ perJarTsp: 0.25, totalTsp: 1.75 });
    expect((cacl.cautions as string[]).length).toBeGreaterThan(0);
    const lime = (await call(crisping, 'crisping', { agent: 'pickling-lime', jar: 'pint', jars: 8 })).body;
    expect(lime).toMatchObject({ limeCups: 1, waterGallons: 1, soakHours: [12, 24], rinses: 3 });
    expect((lime.cautions as string[]).join(' ')).toMatch(/three times/);
  });

  it('answers 400 and 422', async () => {
    await expect400(crisping, 'crisping', { agent: 'alum', jar: 'pint', jars: 1 }, 'agent');
    await expect400(crisping, 'crisping', { agent: 'calcium-chloride', jar: 'pint', jars: 1.5 }, 'jars', 'The number of jars must be a whole number.');
    await expect422(crisping, 'crisping', { agent: 'calcium-chloride', jar: 'half-pint', jars: 4 }, 'jar');
  });
});

describe('GET /api/tools/batch', () => {
  it('answers produce, brine with its margin and the ingredients', async () => {
    // USDA Guide 6, quick fresh-pack dill: 8 lb cucumbers and 14 cups of liquid for about 9 pints.
    const { status, body } = await call(batch, 'batch', { product: 'fresh-pack-dill-pickles', jar: 'pint', jars: 9 });
    expect(status).toBe(200);
    expect(body).toMatchObject({ produceLb: 8, extraPct: 10, brineMl: Math.round(14 * mlPer('cup') * 1.1) });
    expect((body.ingredients as { name: string; amount: number; unit: string }[]).some((i) => i.unit === 'head' && i.amount === 14)).toBe(true);
  });

  it('answers 400, 404 and 422', async () => {
    await expect400(batch, 'batch', { product: 'dilly-beans', jar: 'pint', jars: 0 }, 'jars');
    expect((await call(batch, 'batch', { product: 'kimchi', jar: 'pint', jars: 2 })).status).toBe(404);
    await expect422(batch, 'batch', { product: 'dilly-beans', jar: 'quart', jars: 2 }, 'jar');
  });
});

describe('GET /api/tools/convert', () => {
  it('answers exact conversions (NIST HB 44: 1 cup = 236.5882365 mL; 212 °F = 100 °C)', async () => {
    expect((await call(convert, 'convert', { value: 1, from: 'cup', to: 'mL' })).body.value as number).toBeCloseTo(236.5882365, 9);
    expect((await call(convert, 'convert', { value: 212, from: 'F', to: 'C' })).body.value as number).toBeCloseTo(100, 10);
    expect((await call(convert, 'convert', { value: -18, from: 'C', to: 'F' })).body.value as number).toBeCloseTo(-0.4, 10);
  });

  it('answers 400 between different kinds of quantity and for bad values', async () => {
    const body = await expect400(convert, 'convert', { value: 1, from: 'cup', to: 'g' }, 'to');
    expect(body.message).toContain('density');
    await expect400(convert, 'convert', { value: 1, from: 'cup', to: 'ft' }, 'to');
    await expect400(convert, 'convert', { value: 'one', from: 'cup', to: 'mL' }, 'value');
    await expect400(convert, 'convert', { value: -1, from: 'cup', to: 'mL' }, 'value');
    await expect400(convert, 'convert', { value: 1, from: 'bushel', to: 'mL' }, 'from');
  });
});
