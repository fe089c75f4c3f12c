import type { Preferences, Role } from '../auth/auth.schema';
import type { SeasonExport } from './season-export.schema';

/**
 * Everything an account holds, as `GET /api/auth/me/export.json` writes it. Each of `cars` is a season file
 * (`scrubline-season`) that imports on its own; the rest names other people's records without copying them.
 */
export interface AccountExport {
  format: 'scrubline-account';
  version: 1;
  exportedAt: string;
  account: { email: string; displayName: string; createdAt: string; roles: Role[]; preferences: Preferences };
  memberships: {
    shops: { name: string; admin: boolean }[];
    teams: { name: string; captain: boolean }[];
    coDriverOf: { car: string; owner: string }[];
  };
  cars: SeasonExport[];
  /** Runs this account drove on cars it does not own. */
  runsOnOtherCars: {
    car: string;
    owner: string;
    event: { name: string; date: string; venue: string | null };
    runNumber: number;
    rawTimeSec: number | null;
    cones: number;
    status: string;
    recordedAt: string;
    notes: string | null;
  }[];
  /** What this account wrote in comment threads, on any car. */
  comments: { car: string; on: 'run' | 'event' | 'setup' | 'tread reading' | 'car'; body: string; createdAt: string }[];
}

/** Where the account's file downloads from (a plain link: the browser saves it). */
export const ACCOUNT_EXPORT_PATH = '/api/auth/me/export.json';
