import seedrandom from 'seedrandom';
import type { EntityManager } from 'typeorm';
import { CORNERS, type Corner } from '@shared/season/corners';
import type { SetupCorner } from '@shared/season/setup.schema';
import { hotPressureKpa } from '@shared/calc/pressure.calc';
import { CarCoDriverEntity, CarEntity } from '../features/cars/car.entity';
import { SetupCornerEntity, SetupSnapshotEntity } from '../features/setups/setup.entity';
import { ChangeLogEntity } from '../features/changes/change.entity';
import { EventEntity } from '../features/events/event.entity';
import { RunEntity } from '../features/runs/run.entity';
import { PressureReadingEntity } from '../features/pressures/pressure.entity';
import { TreadReadingCornerEntity, TreadReadingEntity, TyreMountingEntity, TyreSetEntity } from '../features/tyres/tyre.entity';

/**
 * The demo season: an invented club (Tallow Creek Motor Club), invented venues and
 * people, three cars, eight autocross events from April to September 2026. Built
 * from seeded generators, so every run of the seed gives the same season.
 *
 * The story in the numbers: Maren's roadster starts the season at −1.2° front
 * camber, all the stock arms allow, with a little toe-out to help it turn in; its
 * front tyres scrub their inner edges. On 12 June the shop fits adjustable camber
 * arms and aligns it at −2.4° with zero toe, and the front inner-edge wear drops.
 * Wren's roadster, the other SR car in the team, is the quicker of the two in the
 * spring; from the summer Pebble is, which the captain's class board shows.
 */
export const DEMO_SEED = 'tallow-creek-2026';
export const DEMO_CAMBER_ARMS_DATE = '2026-06-12';

export interface DemoPeople {
  driver: string;
  coDriver: string;
  secondDriver: string;
  classRival: string;
  shopStaff: string;
  teamId: string;
}

interface CourseDay {
  name: string;
  date: string;
  venue: string;
  surface: string;
  airTempC: number;
  trackTempC: number;
  /** A course's typical clean time for the roadster, s. Courses differ event to event. */
  baseSec: number;
}

const EVENTS: CourseDay[] = [
  { name: 'Tallow Creek MC — Spring Round 1', date: '2026-04-12', venue: 'Harrow Flats airfield', surface: 'old concrete', airTempC: 11, trackTempC: 15, baseSec: 48.2 },
  { name: 'Tallow Creek MC — Spring Round 2', date: '2026-05-03', venue: 'Quarry Lane car park', surface: 'coarse asphalt', airTempC: 15, trackTempC: 24, baseSec: 52.6 },
  { name: 'Tallow Creek MC — Spring Round 3', date: '2026-05-24', venue: 'Mellingford business park', surface: 'smooth asphalt', airTempC: 19, trackTempC: 31, baseSec: 44.9 },
  { name: 'Tallow Creek MC — Summer Round 1', date: '2026-06-07', venue: 'Harrow Flats airfield', surface: 'old concrete', airTempC: 22, trackTempC: 36, baseSec: 50.3 },
  { name: 'Tallow Creek MC — Summer Round 2', date: '2026-06-28', venue: 'Old Sawmill lot', surface: 'patched asphalt', airTempC: 26, trackTempC: 43, baseSec: 46.7 },
  { name: 'Tallow Creek MC — Summer Round 3', date: '2026-07-19', venue: 'Quarry Lane car park', surface: 'coarse asphalt', airTempC: 28, trackTempC: 47, baseSec: 53.8 },
  { name: 'Tallow Creek MC — Autumn Round 1', date: '2026-08-30', venue: 'Mellingford business park', surface: 'smooth asphalt', airTempC: 21, trackTempC: 33, baseSec: 45.6 },
  { name: 'Tallow Creek MC — Autumn Round 2', date: '2026-09-20', venue: 'Harrow Flats airfield', surface: 'old concrete', airTempC: 14, trackTempC: 20, baseSec: 49.1 },
];

type Values = Record<Corner, SetupCorner>;

const at = (date: string, time: string) => new Date(`${date}T${time}:00Z`);
const round = (n: number, step: number) => Math.round(n / step) * step;
const fix = (n: number, digits: number) => Number(n.toFixed(digits));

/** A setup snapshot with its four corners; its id. */
async function saveSnapshot(m: EntityManager, carId: string, label: string, effectiveFrom: Date, values: Values, opts: {
  createdBy: string; derivedFromId: string | null; notes?: string; arb: [string, string];
}): Promise<string> {
  const s = await m.getRepository(SetupSnapshotEntity).save({
    carId, label, effectiveFrom, createdBy: opts.createdBy, derivedFromId: opts.derivedFromId,
    notes: opts.notes ?? null, frontAntiRollBar: opts.arb[0], rearAntiRollBar: opts.arb[1],
  } as SetupSnapshotEntity);
  for (const corner of CORNERS) {
    await m.getRepository(SetupCornerEntity).save({ setupId: s.id, corner, ...values[corner] } as SetupCornerEntity);
  }
  return s.id;
}

/** Roughly normal noise from a seeded generator (the sum of three uniforms), sd ≈ spread / 1.7. */
function noiseFrom(rng: () => number): (spread: number) => number {
  return (spread) => (rng() + rng() + rng() - 1.5) * (spread / 0.5);
}

/** Version-4-shaped ids from a seeded generator, so a run's id is the same on every seed. */
function uuidFrom(rng: () => number): () => string {
  return () => {
    const hex = Array.from({ length: 32 }, () => Math.floor(rng() * 16).toString(16)).join('');
    return `${hex.slice(0, 8)}-${hex.slice(8, 12)}-4${hex.slice(13, 16)}-${'89ab'[Math.floor(rng() * 4)]}${hex.slice(17, 20)}-${hex.slice(20, 32)}`;
  };
}

export async function seedDemoSeason(m: EntityManager, people: DemoPeople): Promise<void> {
  const rng = seedrandom(DEMO_SEED);
  const noise = noiseFrom(rng);
  const uuid = uuidFrom(rng);

  // ---------- cars ----------
  const roadster = await m.getRepository(CarEntity).save({
    ownerId: people.driver,
    name: 'Pebble',
    classCode: 'SR',
    carNumber: '42',
    tyreSize: '205/50R15',
    frontDamperPositions: 12,
    frontDamperCountFrom: 'full_soft',
    rearDamperPositions: 12,
    rearDamperCountFrom: 'full_soft',
    frontMotionRatio: 0.7,
    rearMotionRatio: 0.74,
    notes: 'Small rear-drive roadster, shared with Teo. Clicks counted from full soft.',
  } as CarEntity);
  await m.getRepository(CarCoDriverEntity).save({ carId: roadster.id, userId: people.coDriver });
  const hatch = await m.getRepository(CarEntity).save({
    ownerId: people.secondDriver,
    name: 'Biscuit Tin',
    classCode: 'SH',
    carNumber: '7',
    tyreSize: '215/45R17',
    frontDamperPositions: 16,
    frontDamperCountFrom: 'full_stiff',
    rearDamperPositions: null,
    rearDamperCountFrom: null,
    frontMotionRatio: 0.95,
    rearMotionRatio: null,
    notes: 'Compact front-drive hatch. Front dampers adjustable (counted from full stiff); rear fixed.',
  } as CarEntity);

  // ---------- setups ----------
  const snapshot = saveSnapshot.bind(null, m);
  const clone = (v: Values): Values => structuredClone(v);

  let roadsterValues: Values = {
    lf: { camberDeg: -1.2, toeMm: -0.8, casterDeg: 5.5, springRateNPerMm: 35, rideHeightMm: 122, damperClicks: 6, damperReboundClicks: null, coldPressureKpa: 200, cornerWeightKg: 258 },
    rf: { camberDeg: -1.2, toeMm: -0.8, casterDeg: 5.6, springRateNPerMm: 35, rideHeightMm: 121, damperClicks: 6, damperReboundClicks: null, coldPressureKpa: 200, cornerWeightKg: 249 },
    lr: { camberDeg: -1.6, toeMm: 1.0, casterDeg: null, springRateNPerMm: 28, rideHeightMm: 127, damperClicks: 5, damperReboundClicks: null, coldPressureKpa: 193, cornerWeightKg: 266 },
    rr: { camberDeg: -1.6, toeMm: 1.0, casterDeg: null, springRateNPerMm: 28, rideHeightMm: 128, damperClicks: 5, damperReboundClicks: null, coldPressureKpa: 193, cornerWeightKg: 271 },
  };
  let roadsterSetup = await snapshot(roadster.id, 'Season baseline', at('2026-04-01', '09:00'), roadsterValues, {
    createdBy: people.driver, derivedFromId: null, arb: ['hole 2 of 3', 'hole 1 of 3'],
    notes: 'Front camber is at the limit of the stock arms; a little toe-out helps turn-in.',
  });
  await m.getRepository(ChangeLogEntity).save({
    carId: roadster.id, changedOn: '2026-04-01', what: 'Season baseline alignment and corner weights', location: 'car',
    notes: 'Weighed with driver in and half a tank.', setupId: roadsterSetup, createdBy: people.driver,
  } as ChangeLogEntity);

  let hatchValues: Values = {
    lf: { camberDeg: -1.0, toeMm: 0, casterDeg: 4.2, springRateNPerMm: 45, rideHeightMm: 118, damperClicks: 8, damperReboundClicks: null, coldPressureKpa: 234, cornerWeightKg: 352 },
    rf: { camberDeg: -1.0, toeMm: 0, casterDeg: 4.1, springRateNPerMm: 45, rideHeightMm: 118, damperClicks: 8, damperReboundClicks: null, coldPressureKpa: 234, cornerWeightKg: 338 },
    lr: { camberDeg: -0.8, toeMm: 0.5, casterDeg: null, springRateNPerMm: 60, rideHeightMm: 124, damperClicks: null, damperReboundClicks: null, coldPressureKpa: 248, cornerWeightKg: 226 },
    rr: { camberDeg: -0.8, toeMm: 0.5, casterDeg: null, springRateNPerMm: 60, rideHeightMm: 124, damperClicks: null, damperReboundClicks: null, coldPressureKpa: 248, cornerWeightKg: 232 },
  };
  let hatchSetup = await snapshot(hatch.id, 'Season baseline', at('2026-04-05', '10:00'), hatchValues, {
    createdBy: people.secondDriver, derivedFromId: null, arb: ['stock', 'stiff rear bar, hole 2'],
  });

  // ---------- tyre sets ----------
  const roadsterSet = await m.getRepository(TyreSetEntity).save({
    carId: roadster.id, label: 'Set A (205/50R15)', size: '205/50R15', boughtOn: '2026-03-20', startTreadMm: 7.1, notes: null,
  } as TyreSetEntity);
  await m.getRepository(TyreMountingEntity).save({ tyreSetId: roadsterSet.id, mountedAt: at('2026-03-20', '12:00'), lfTyre: 1, rfTyre: 2, lrTyre: 3, rrTyre: 4 });
  const hatchSet = await m.getRepository(TyreSetEntity).save({
    carId: hatch.id, label: 'Set 1 (215/45R17)', size: '215/45R17', boughtOn: '2026-03-28', startTreadMm: 7.5, notes: 'Rotated front to rear in July.',
  } as TyreSetEntity);
  await m.getRepository(TyreMountingEntity).save({ tyreSetId: hatchSet.id, mountedAt: at('2026-03-28', '12:00'), lfTyre: 1, rfTyre: 2, lrTyre: 3, rrTyre: 4 });

  // Tread per tyre (by tyre number), inner / middle / outer, mm.
  const tread = (start: number) => new Map([1, 2, 3, 4].map((n) => [n, { inner: start, middle: start, outer: start }]));
  const roadsterTread = tread(7.1);
  const hatchTread = tread(7.5);
  let hatchPositions: Record<Corner, number> = { lf: 1, rf: 2, lr: 3, rr: 4 };
  const roadsterPositions: Record<Corner, number> = { lf: 1, rf: 2, lr: 3, rr: 4 };

  async function treadReading(setId: string, takenAt: Date, eventId: string | null, positions: Record<Corner, number>, depths: ReturnType<typeof tread>, by: string) {
    const r = await m.getRepository(TreadReadingEntity).save({ tyreSetId: setId, takenAt, eventId, notes: null, createdBy: by } as TreadReadingEntity);
    for (const corner of CORNERS) {
      const d = depths.get(positions[corner])!;
      const read = (v: number) => fix(Math.max(0, round(v + noise(0.04), 0.1)), 1);
      await m.getRepository(TreadReadingCornerEntity).save({ readingId: r.id, corner, innerMm: read(d.inner), middleMm: read(d.middle), outerMm: read(d.outer) });
    }
  }
  await treadReading(roadsterSet.id, at('2026-04-01', '09:30'), null, roadsterPositions, roadsterTread, people.driver);
  await treadReading(hatchSet.id, at('2026-04-05', '10:30'), null, hatchPositions, hatchTread, people.secondDriver);

  // ---------- events and runs ----------
  const armsFitted = at(DEMO_CAMBER_ARMS_DATE, '15:00');
  const tweaks: { label: string; apply: (v: Values) => void }[] = [
    { label: 'rear clicks +2', apply: (v) => { v.lr.damperClicks! += 2; v.rr.damperClicks! += 2; } },
    { label: 'cold pressure −7 kPa all round', apply: (v) => { for (const c of CORNERS) v[c].coldPressureKpa! -= 7; } },
    { label: 'front clicks +1', apply: (v) => { v.lf.damperClicks! += 1; v.rf.damperClicks! += 1; } },
    { label: 'rear clicks −1', apply: (v) => { v.lr.damperClicks! -= 1; v.rr.damperClicks! -= 1; } },
    { label: 'front cold pressure +7 kPa', apply: (v) => { v.lf.coldPressureKpa! += 7; v.rf.coldPressureKpa! += 7; } },
    { label: 'rear clicks +1', apply: (v) => { v.lr.damperClicks! += 1; v.rr.damperClicks! += 1; } },
    { label: 'front clicks −1', apply: (v) => { v.lf.damperClicks! -= 1; v.rf.damperClicks! -= 1; } },
    { label: 'rear cold pressure −7 kPa', apply: (v) => { v.lr.coldPressureKpa! -= 7; v.rr.coldPressureKpa! -= 7; } },
  ];

  const eventIds: string[] = [];
  for (const [i, day] of EVENTS.entries()) {
    // The camber arms go on between the fourth and fifth events.
    if (i === 4) {
      const next = clone(roadsterValues);
      next.lf.camberDeg = -2.4; next.rf.camberDeg = -2.4;
      next.lf.toeMm = 0; next.rf.toeMm = 0;
      next.lf.cornerWeightKg = 256; next.rf.cornerWeightKg = 251; next.lr.cornerWeightKg = 268; next.rr.cornerWeightKg = 269;
      roadsterSetup = await snapshot(roadster.id, 'Camber arms fitted, aligned and corner-balanced', armsFitted, next, {
        createdBy: people.shopStaff, derivedFromId: roadsterSetup, arb: ['hole 2 of 3', 'hole 1 of 3'],
        notes: 'Adjustable front camber arms; −2.4° front, zero front toe. Corner-balanced with driver in, half tank: cross 50.3 %.',
      });
      roadsterValues = next;
      for (const entry of [
        { what: 'Front adjustable camber arms fitted', location: 'front' as const, notes: 'Fitted by Kettle Lane Chassis Works.' },
        { what: 'Alignment: front camber −2.4°, front toe zero', location: 'front' as const, notes: null },
        { what: 'Corner balance with driver in', location: 'car' as const, notes: 'Cross weight 50.3 %.' },
      ]) {
        await m.getRepository(ChangeLogEntity).save({ carId: roadster.id, changedOn: DEMO_CAMBER_ARMS_DATE, setupId: roadsterSetup, createdBy: people.shopStaff, ...entry } as ChangeLogEntity);
      }
    }
    // The hatch's tyres are rotated front to rear before the sixth event.
    if (i === 5) {
      hatchPositions = { lf: 3, rf: 4, lr: 1, rr: 2 };
      await m.getRepository(TyreMountingEntity).save({ tyreSetId: hatchSet.id, mountedAt: at('2026-07-01', '12:00'), lfTyre: 3, rfTyre: 4, lrTyre: 1, rrTyre: 2 });
    }

    const event = await m.getRepository(EventEntity).save({
      createdBy: people.driver, name: day.name, date: day.date, venue: day.venue, kind: 'autocross', conePenaltySec: 2,
      surface: day.surface, airTempC: day.airTempC, trackTempC: day.trackTempC, notes: null, teamId: people.teamId,
    } as EventEntity);
    eventIds.push(event.id);

    // Morning cold pressures, as set in the paddock.
    for (const [carId, values, by] of [[roadster.id, roadsterValues, people.driver], [hatch.id, hatchValues, people.secondDriver]] as const) {
      await m.getRepository(PressureReadingEntity).save({
        carId, kind: 'cold', takenAt: at(day.date, '08:30'), runId: null, createdBy: by,
        lfKpa: values.lf.coldPressureKpa, rfKpa: values.rf.coldPressureKpa, lrKpa: values.lr.coldPressureKpa, rrKpa: values.rr.coldPressureKpa,
      } as PressureReadingEntity);
    }

    // Runs: the roadster's two drivers alternate; the hatch runs in the other heat.
    const roadsterRuns = 7 + (i % 2); // 7 or 8
    const hatchRuns = 6 + ((i + 1) % 2); // 7 or 6
    const tweakAfter = 3;
    const logRun = async (carId: string, driverId: string, runNumber: number, time: Date, baseSec: number, values: Values, status: RunEntity['status']) => {
      const cones = status === 'finished' && rng() < 0.14 ? (rng() < 0.25 ? 2 : 1) : 0;
      const learning = -0.7 * (1 - Math.exp(-runNumber / 2));
      const raw = status === 'dnf' ? null : fix(baseSec + learning + noise(0.3), 3);
      const id = uuid();
      await m.getRepository(RunEntity).save({ id, carId, eventId: event.id, driverId, runNumber, rawTimeSec: raw, cones, status, recordedAt: time, notes: null } as RunEntity);
      if (rng() < 0.6) {
        const tyreC = day.trackTempC + 22 + noise(3);
        const hot = (c: Corner) => fix(round(hotPressureKpa({ coldGaugeKpa: values[c].coldPressureKpa!, coldTempC: day.airTempC, hotTempC: tyreC }) + noise(2), 1), 0);
        await m.getRepository(PressureReadingEntity).save({
          carId, kind: 'hot', takenAt: time, runId: id, createdBy: driverId, lfKpa: hot('lf'), rfKpa: hot('rf'), lrKpa: hot('lr'), rrKpa: hot('rr'),
        } as PressureReadingEntity);
      }
    };

    let maren = 0;
    let teo = 0;
    for (let k = 0; k < roadsterRuns; k++) {
      const time = new Date(at(day.date, '09:10').getTime() + k * 22 * 60_000);
      if (k === tweakAfter) {
        const t = tweaks[i]!;
        const next = clone(roadsterValues);
        t.apply(next);
        roadsterSetup = await snapshot(roadster.id, `Quick change: ${t.label}`, new Date(time.getTime() - 5 * 60_000), next, {
          createdBy: people.driver, derivedFromId: roadsterSetup, arb: ['hole 2 of 3', 'hole 1 of 3'],
        });
        roadsterValues = next;
      }
      const isMaren = k % 2 === 0;
      const driverId = isMaren ? people.driver : people.coDriver;
      const runNumber = isMaren ? ++maren : ++teo;
      const status: RunEntity['status'] = i === 2 && !isMaren && runNumber === 2 ? 'dnf' : 'finished';
      await logRun(roadster.id, driverId, runNumber, time, day.baseSec + (isMaren ? 0 : 0.6), roadsterValues, status);
    }
    for (let k = 0; k < hatchRuns; k++) {
      const time = new Date(at(day.date, '09:20').getTime() + k * 22 * 60_000);
      if (k === tweakAfter && i % 2 === 1) {
        const next = clone(hatchValues);
        next.lf.coldPressureKpa! += 7; next.rf.coldPressureKpa! += 7;
        hatchSetup = await snapshot(hatch.id, 'Quick change: front cold pressure +7 kPa', new Date(time.getTime() - 5 * 60_000), next, {
          createdBy: people.secondDriver, derivedFromId: hatchSetup, arb: ['stock', 'stiff rear bar, hole 2'],
        });
        hatchValues = next;
      }
      const status: RunEntity['status'] = i === 5 && k === 3 ? 'off_course' : 'finished';
      await logRun(hatch.id, people.secondDriver, k + 1, time, day.baseSec * 1.035, hatchValues, status);
    }

    // Wear from the day's runs. The roadster's front inner edges wear fast until the arms go on.
    const afterArms = i >= 4;
    for (const [tyre, corner] of Object.entries(roadsterPositions).map(([c, n]) => [n, c as Corner] as const)) {
      const front = corner === 'lf' || corner === 'rf';
      const perRun = front
        ? afterArms ? { inner: 0.046, middle: 0.05, outer: 0.052 } : { inner: 0.088, middle: 0.05, outer: 0.064 }
        : { inner: 0.036, middle: 0.04, outer: 0.035 };
      const d = roadsterTread.get(tyre)!;
      d.inner -= perRun.inner * roadsterRuns * (1 + noise(0.05));
      d.middle -= perRun.middle * roadsterRuns * (1 + noise(0.05));
      d.outer -= perRun.outer * roadsterRuns * (1 + noise(0.05));
    }
    for (const [tyre, corner] of Object.entries(hatchPositions).map(([c, n]) => [n, c as Corner] as const)) {
      const front = corner === 'lf' || corner === 'rf';
      const perRun = front ? { inner: 0.06, middle: 0.07, outer: 0.085 } : { inner: 0.024, middle: 0.025, outer: 0.024 };
      const d = hatchTread.get(tyre)!;
      d.inner -= perRun.inner * hatchRuns * (1 + noise(0.05));
      d.middle -= perRun.middle * hatchRuns * (1 + noise(0.05));
      d.outer -= perRun.outer * hatchRuns * (1 + noise(0.05));
    }
    await treadReading(roadsterSet.id, at(day.date, '17:00'), event.id, roadsterPositions, roadsterTread, people.driver);
    await treadReading(hatchSet.id, at(day.date, '17:10'), event.id, hatchPositions, hatchTread, people.secondDriver);
  }

  await seedClassRival(m, people, eventIds);
}

/**
 * Wren's roadster, the team's other SR car: a baseline setup and six runs at each event,
 * from a generator of its own so the rest of the season stays as it was. Quicker than
 * Pebble by about 0.4 s a course in the spring, slower by about the same from the summer.
 */
async function seedClassRival(
  m: EntityManager,
  people: DemoPeople,
  eventIds: string[],
): Promise<void> {
  const rng = seedrandom(`${DEMO_SEED}/class-rival`);
  const noise = noiseFrom(rng);
  const uuid = uuidFrom(rng);
  const car = await m.getRepository(CarEntity).save({
    ownerId: people.classRival,
    name: 'Gooseberry',
    classCode: 'SR',
    carNumber: '88',
    tyreSize: '195/50R15',
    frontDamperPositions: null,
    frontDamperCountFrom: null,
    rearDamperPositions: null,
    rearDamperCountFrom: null,
    frontMotionRatio: null,
    rearMotionRatio: null,
    notes: 'Small rear-drive roadster on fixed dampers.',
  } as CarEntity);
  const front: SetupCorner = { camberDeg: -1.8, toeMm: 0, casterDeg: 5.2, springRateNPerMm: 32, rideHeightMm: 125, damperClicks: null, damperReboundClicks: null, coldPressureKpa: 207, cornerWeightKg: 252 };
  const rear: SetupCorner = { camberDeg: -1.5, toeMm: 1.2, casterDeg: null, springRateNPerMm: 26, rideHeightMm: 130, damperClicks: null, damperReboundClicks: null, coldPressureKpa: 200, cornerWeightKg: 262 };
  await saveSnapshot(m, car.id, 'Season baseline', at('2026-04-02', '18:00'), { lf: front, rf: { ...front }, lr: rear, rr: { ...rear } }, {
    createdBy: people.classRival, derivedFromId: null, arb: ['stock', 'stock'],
  });
  for (const [i, day] of EVENTS.entries()) {
    const pace = day.baseSec + (i < 4 ? -0.4 : 0.4);
    for (let k = 0; k < 6; k++) {
      const runNumber = k + 1;
      const cones = rng() < 0.14 ? 1 : 0;
      const learning = -0.7 * (1 - Math.exp(-runNumber / 2));
      await m.getRepository(RunEntity).save({
        id: uuid(), carId: car.id, eventId: eventIds[i], driverId: people.classRival, runNumber,
        rawTimeSec: fix(pace + learning + noise(0.3), 3), cones, status: 'finished',
        recordedAt: new Date(at(day.date, '09:30').getTime() + k * 22 * 60_000), notes: null,
      } as RunEntity);
    }
  }
}
