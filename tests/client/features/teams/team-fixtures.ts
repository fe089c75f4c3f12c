import type { Car } from '../../../../shared/season/car.schema';
import type { BoardCar, ClassBoard, Team } from '../../../../shared/collab/team.schema';
import { CAR, IDS } from '../../fixtures/season';

/*
 * An invented team for client tests: "Harrow Flats Sprint Club", captained by Ines Okafor, with
 * Maren Holt (the fixture's signed-in user) as a member. All names and numbers are made up.
 */
export const TEAM_IDS = {
  team: '7e111111-1111-4111-8111-111111111111',
  ines: 'a3333333-3333-4333-8333-333333333333',
  inesCar: 'c3333333-3333-4333-8333-333333333333',
  marenHatch: 'c2222222-2222-4222-8222-222222222222',
  coDriven: 'c4444444-4444-4444-8444-444444444444',
} as const;

/** Maren's second car, not yet entered. */
export const MAREN_HATCH: Car = {
  ...CAR,
  id: TEAM_IDS.marenHatch,
  name: 'Blue hatch',
  classCode: 'HS',
  carNumber: '12',
  coDrivers: [],
};

/** Ines's car that Maren co-drives: listed in her cars, but not hers to enter. */
export const CO_DRIVEN: Car = {
  ...CAR,
  id: TEAM_IDS.coDriven,
  name: 'Red coupe',
  classCode: 'STR',
  carNumber: '5',
  owner: { id: TEAM_IDS.ines, displayName: 'Ines Okafor' },
  coDrivers: [{ id: IDS.maren, displayName: 'Maren Holt' }],
};

export function team(isCaptain: boolean): Team {
  return {
    id: TEAM_IDS.team,
    name: 'Harrow Flats Sprint Club',
    isCaptain,
    members: [
      { id: TEAM_IDS.ines, displayName: 'Ines Okafor', isCaptain: true },
      { id: IDS.maren, displayName: 'Maren Holt', isCaptain },
    ],
    entries: [
      {
        car: { id: IDS.car, name: CAR.name, carNumber: CAR.carNumber },
        owner: { id: IDS.maren, displayName: 'Maren Holt' },
        classCode: 'SM',
        sharing: 'results',
        mine: true,
      },
      {
        car: { id: TEAM_IDS.inesCar, name: 'White roadster', carNumber: '3' },
        owner: { id: TEAM_IDS.ines, displayName: 'Ines Okafor' },
        classCode: 'STR',
        sharing: 'results_and_setup',
        mine: false,
      },
    ],
    pendingInvitations: isCaptain ? [{ email: 'dara@example.test', asAdmin: false, expiresAt: '2026-06-20T10:00:00.000Z' }] : [],
  };
}

const EVENT_3 = { eventId: 'e3333333-3333-4333-8333-333333333333', eventName: 'Harrow Flats — Round 3', date: '2026-05-17' };
const EVENT_4 = { eventId: 'e4444444-4444-4444-8444-444444444444', eventName: 'Harrow Flats — Round 4', date: '2026-06-07' };

const MAREN = { id: IDS.maren, displayName: 'Maren Holt' };
const INES = { id: TEAM_IDS.ines, displayName: 'Ines Okafor' };

/** Maren's roadster in SM (no factor entered), sharing results only. */
export const MAREN_BOARD_CAR: BoardCar = {
  car: { id: IDS.car, name: CAR.name, carNumber: CAR.carNumber },
  owner: MAREN,
  sharing: 'results',
  results: [
    {
      ...EVENT_3, driver: MAREN, runs: { finished: 3, dnf: 0, offCourse: 0 },
      bestRawSec: 45.6, bestRawCones: 1, bestAdjustedSec: 47.6, indexSec: null, pctOffClassFastest: 1.2, rankInClass: 2,
    },
    {
      ...EVENT_4, driver: MAREN, runs: { finished: 2, dnf: 1, offCourse: 0 },
      bestRawSec: 44.9, bestRawCones: 0, bestAdjustedSec: 44.9, indexSec: null, pctOffClassFastest: 0.8, rankInClass: 2,
    },
  ],
  trendPctPerEvent: -0.4,
  setup: null,
  wear: null,
};

/** Ines's second car, Maren's classmate in SM and its fastest at both rounds; its setup shared but none recorded. */
export const SILVER_BOARD_CAR: BoardCar = {
  car: { id: 'c5555555-5555-4555-8555-555555555555', name: 'Silver roadster', carNumber: '8' },
  owner: INES,
  sharing: 'results_and_setup',
  results: [
    // 47.036 × 1.012 = 47.600 (Maren, +1.20 %); 44.544 × 1.008 = 44.900 (Maren, +0.80 %), to the thousandth.
    {
      ...EVENT_3, driver: INES, runs: { finished: 3, dnf: 0, offCourse: 0 },
      bestRawSec: 47.036, bestRawCones: 0, bestAdjustedSec: 47.036, indexSec: null, pctOffClassFastest: 0, rankInClass: 1,
    },
    {
      ...EVENT_4, driver: INES, runs: { finished: 3, dnf: 0, offCourse: 0 },
      bestRawSec: 44.544, bestRawCones: 0, bestAdjustedSec: 44.544, indexSec: null, pctOffClassFastest: 0, rankInClass: 1,
    },
  ],
  trendPctPerEvent: 0,
  setup: null,
  wear: null,
};

/** Ines's roadster in STR (factor 0.853), sharing its setup; the only car in its class. */
export const INES_BOARD_CAR: BoardCar = {
  car: { id: TEAM_IDS.inesCar, name: 'White roadster', carNumber: '3' },
  owner: INES,
  sharing: 'results_and_setup',
  results: [
    {
      ...EVENT_4, driver: INES, runs: { finished: 2, dnf: 0, offCourse: 0 },
      bestRawSec: 61.25, bestRawCones: 1, bestAdjustedSec: 63.25, indexSec: 53.952, pctOffClassFastest: 0, rankInClass: 1,
    },
  ],
  trendPctPerEvent: null,
  setup: {
    label: 'Round 4 baseline',
    effectiveFrom: '2026-06-01T08:00:00.000Z',
    frontCamberDeg: -2.1,
    rearCamberDeg: -1.5,
    frontSpringNPerMm: 70,
    rearSpringNPerMm: 52.5,
    frontClicks: 8,
    rearClicks: 6,
    frontColdKpa: 200,
    rearColdKpa: 190,
  },
  // Front: inner 0.4 mm below outer; rear: inner 0.2 mm above outer, read a week earlier.
  wear: {
    front: { meanDepthMm: 5.08, innerMinusOuterMm: -0.4, takenAt: '2026-06-07T16:00:00.000Z' },
    rear: { meanDepthMm: 6.33, innerMinusOuterMm: 0.2, takenAt: '2026-05-31T16:00:00.000Z' },
  },
};

export const BOARD: ClassBoard = {
  team: { id: TEAM_IDS.team, name: 'Harrow Flats Sprint Club', isCaptain: false },
  season: 2026,
  classes: [
    { classCode: 'SM', factor: null, cars: [MAREN_BOARD_CAR, SILVER_BOARD_CAR] },
    { classCode: 'STR', factor: 0.853, cars: [INES_BOARD_CAR] },
  ],
};
