import semver from 'semver';

/*
 * Published security advisories against packages the app ships, each with the versions it affects, kept
 * so that the lockfile can be checked without the registry's audit service (tests/scripts/advisories.test.ts).
 * Each row names its advisory: a GHSA id of the GitHub Advisory Database (https://github.com/advisories/<id>),
 * or the CVE where no GHSA id was found; the ranges are the advisory's own. It stands beside `npm audit --omit=dev`, never instead of it: an advisory
 * published after a row was written is not here. docs/security.md says when the list was last gone through.
 */
export interface Advisory {
  name: string;
  /** The versions the advisory says are affected, as a semver range. */
  affected: string;
  id: string;
  /** As the advisory rates it; `unrated` where the published record gives no rating. */
  severity: 'critical' | 'high' | 'moderate' | 'low' | 'unrated';
}

export const ADVISORIES: readonly Advisory[] = [
  // Routing and request parsing (Express 5)
  { name: 'path-to-regexp', affected: '>=8.0.0 <8.4.0', id: 'GHSA-j3q9-mxjg-w52f', severity: 'high' },
  { name: 'path-to-regexp', affected: '<0.1.13', id: 'GHSA-37ch-88jc-xwx2', severity: 'high' },
  { name: 'qs', affected: '>=6.11.1 <6.15.2', id: 'GHSA-q8mj-m7cp-5q26', severity: 'moderate' },
  { name: 'body-parser', affected: '>=2.0.0 <2.3.0 || <1.20.6', id: 'GHSA-v422-hmwv-36x6', severity: 'low' },
  { name: 'proxy-addr', affected: '>=1.1.0 <2.0.8', id: 'GHSA-jqcg-44mw-7w3h', severity: 'critical' },
  { name: 'cookie', affected: '<0.7.0', id: 'GHSA-pxg6-pf52-xh8x', severity: 'low' },
  { name: 'on-headers', affected: '<1.1.0', id: 'CVE-2025-7339', severity: 'low' },
  // Sign-in and sessions
  { name: 'passport', affected: '<0.6.0', id: 'CVE-2022-25896', severity: 'unrated' },
  // Uploads
  { name: 'multer', affected: '<2.3.0', id: 'GHSA-wc9g-mqfw-jrwm', severity: 'high' },
  { name: 'multer', affected: '<2.2.0', id: 'GHSA-72gw-mp4g-v24j', severity: 'high' },
  { name: 'file-type', affected: '>=20.0.0 <21.3.2', id: 'CVE-2026-32630', severity: 'unrated' },
  { name: 'file-type', affected: '<21.3.1', id: 'GHSA-5v7r-6r5c-r473', severity: 'unrated' },
  { name: 'sharp', affected: '<0.35.4', id: 'GHSA-rgj7-g3m4-5g8c', severity: 'high' },
  // Mail
  { name: 'nodemailer', affected: '<9.0.1', id: 'GHSA-p6gq-j5cr-w38f', severity: 'high' },
  { name: 'nodemailer', affected: '<7.0.11', id: 'GHSA-46j5-6fg5-4gv3', severity: 'high' },
  // Database
  { name: 'typeorm', affected: '<0.3.26', id: 'GHSA-q2pj-6v73-8rgj', severity: 'moderate' },
  { name: 'sha.js', affected: '<=2.4.11', id: 'GHSA-95m3-7q98-8xr5', severity: 'critical' },
  { name: 'uuid', affected: '>=3.0.0 <11.1.1', id: 'GHSA-w5hq-g745-h8pq', severity: 'moderate' },
  // The client and its build
  { name: 'react-router', affected: '>=7.12.0 <7.18.2', id: 'GHSA-qwww-vcr4-c8h2', severity: 'moderate' },
  { name: 'react-router', affected: '>=7.0.0 <7.12.0', id: 'GHSA-2w69-qvjg-hvjx', severity: 'high' },
  { name: 'fast-uri', affected: '<3.1.8', id: 'GHSA-hrr3-gc8f-f4qj', severity: 'moderate' },
  { name: 'vite', affected: '>=8.0.0 <8.0.16', id: 'GHSA-fx2h-pf6j-xcff', severity: 'high' },
  { name: 'esbuild', affected: '>=0.17.0 <0.28.1', id: 'GHSA-gv7w-rqvm-qjhr', severity: 'high' },
  { name: 'postcss', affected: '<8.5.23', id: 'GHSA-fxqj-rqcc-2cmp', severity: 'moderate' },
  { name: 'cross-spawn', affected: '>=7.0.0 <7.0.5', id: 'GHSA-3xgq-45jj-v275', severity: 'high' },
  { name: 'minimatch', affected: '>=9.0.0 <9.0.7', id: 'GHSA-7r86-cg39-jmmj', severity: 'high' },
  { name: 'brace-expansion', affected: '>=2.0.0 <2.1.4', id: 'GHSA-rgw5-rvv9-x895', severity: 'unrated' },
  { name: 'picomatch', affected: '>=4.0.0 <4.0.4', id: 'GHSA-c2c7-rcm5-vvqj', severity: 'high' },
];

/** package-lock.json (lockfileVersion 3): every installed copy, keyed by its folder. */
export interface Lockfile {
  packages: Record<string, { version?: string; dev?: boolean }>;
}

export interface InstalledCopy {
  name: string;
  version: string;
  path: string;
}

/** The copies installed for production (`npm ci --omit=dev` would keep them), with their versions. */
export function productionCopies(lock: Lockfile): InstalledCopy[] {
  return Object.entries(lock.packages).flatMap(([path, entry]) => {
    const at = path.lastIndexOf('node_modules/');
    if (at < 0 || entry.dev || !entry.version) return [];
    return [{ name: path.slice(at + 'node_modules/'.length), version: entry.version, path }];
  });
}

/** Each production copy inside an advisory's affected range, with the advisory. */
export function affectedCopies(lock: Lockfile, advisories: readonly Advisory[] = ADVISORIES) {
  const copies = productionCopies(lock);
  return advisories.flatMap((advisory) =>
    copies
      .filter((c) => c.name === advisory.name && semver.satisfies(c.version, advisory.affected, { includePrerelease: true }))
      .map((copy) => ({ copy, advisory })),
  );
}
