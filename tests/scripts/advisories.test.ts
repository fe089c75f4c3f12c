import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { ADVISORIES, affectedCopies, productionCopies, type Lockfile } from '../../scripts/lib/advisories';

/*
 * The lockfile against published advisories (the GHSA or CVE named on each row of scripts/lib/advisories.ts).
 * `npm audit --omit=dev` asks the registry for the same and more; this keeps the known ones from coming back
 * with a regenerated lockfile when that service cannot be reached.
 */
const lock = JSON.parse(readFileSync(new URL('../../package-lock.json', import.meta.url), 'utf8')) as Lockfile;

describe('production packages against known advisories', () => {
  it('when the lockfile is read, then no production copy of a package is inside an advisory’s affected range', () => {
    const found = affectedCopies(lock).map(({ copy, advisory }) => `${copy.path}@${copy.version}: ${advisory.id} (${advisory.affected})`);
    expect(found).toEqual([]);
  });

  it('when the list is read, then every package it names is installed for production, so a misspelt name cannot pass unseen', () => {
    const installed = new Set(productionCopies(lock).map((c) => c.name));
    expect(ADVISORIES.map((a) => a.name).filter((name) => !installed.has(name))).toEqual([]);
  });

  it('when a copy is in an affected range, nested or at the top, then it is named with the advisory; a development-only copy is not', () => {
    const made: Lockfile = {
      packages: {
        '': {},
        'node_modules/proxy-addr': { version: '2.0.7' },
        'node_modules/express/node_modules/path-to-regexp': { version: '8.3.0' },
        'node_modules/path-to-regexp': { version: '8.4.2' },
        'node_modules/multer': { version: '2.2.0', dev: true },
      },
    };
    expect(affectedCopies(made).map(({ copy, advisory }) => [copy.path, advisory.id])).toEqual([
      ['node_modules/express/node_modules/path-to-regexp', 'GHSA-j3q9-mxjg-w52f'],
      ['node_modules/proxy-addr', 'GHSA-jqcg-44mw-7w3h'],
    ]);
  });

  it.each([
    ['2.0.7', true],
    ['2.0.8', false],
    ['1.0.9', false],
  ])('when proxy-addr is %s, then it is affected: %s (GHSA-jqcg-44mw-7w3h: >=1.1.0 <2.0.8)', (version, affected) => {
    expect(affectedCopies({ packages: { 'node_modules/proxy-addr': { version } } })).toHaveLength(affected ? 1 : 0);
  });

  it('when every row is read, then its range parses and its id is a GHSA or CVE id', async () => {
    const semver = (await import('semver')).default;
    for (const a of ADVISORIES) {
      expect(semver.validRange(a.affected), `${a.name} ${a.affected}`).not.toBeNull();
      expect(a.id).toMatch(/^(GHSA(-[23456789cfghjmpqrvwx]{4}){3}|CVE-\d{4}-\d{4,})$/);
    }
  });
});
