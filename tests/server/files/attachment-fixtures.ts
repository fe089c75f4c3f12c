import { expect } from 'vitest';
import sharp from 'sharp';
import type { TestApp } from '../test-app';
import { addCoDriver, driverWithCarAndEvent, runBody, type Client } from '../season/season-fixtures';
import { signedInClient } from '../test-app';

export interface Upload {
  bytes: Buffer;
  name: string;
  /** What the browser claims; the server ignores it. */
  type?: string;
}

/** POST /api/attachments with the target in the query string, read before any file. */
export const uploadPath = (target: { targetType: string; targetId: string }) =>
  `/api/attachments?${new URLSearchParams({ targetType: target.targetType, targetId: target.targetId }).toString()}`;

/** Sends a multipart upload the way the app does: the target in the query, the files alone in the form. */
export async function upload(c: Client, target: { targetType: string; targetId: string }, files: Upload[]) {
  let req = c.agent.post(uploadPath(target)).set('X-CSRF-Token', await c.csrf());
  for (const f of files) req = req.attach('files', f.bytes, { filename: f.name, contentType: f.type ?? 'application/octet-stream' });
  return req;
}

/** A plain photo made by sharp, width × height pixels. */
export const jpeg = (width: number, height: number, opts: { orientation?: number } = {}) => {
  const img = sharp({ create: { width, height, channels: 3, background: { r: 180, g: 40, b: 30 } } }).jpeg({ quality: 80 });
  return (opts.orientation ? img.withMetadata({ orientation: opts.orientation }) : img).toBuffer();
};
export const png = (width: number, height: number) =>
  sharp({ create: { width, height, channels: 4, background: { r: 20, g: 90, b: 160, alpha: 1 } } }).png().toBuffer();

/** The smallest well-formed PDF: header, one empty catalog and pages tree, cross-reference table and trailer. */
export function tinyPdf(): Buffer {
  const objects = ['1 0 obj\n<< /Type /Catalog /Pages 2 0 R >>\nendobj\n', '2 0 obj\n<< /Type /Pages /Kids [] /Count 0 >>\nendobj\n'];
  let body = '%PDF-1.4\n';
  const offsets: number[] = [];
  for (const o of objects) {
    offsets.push(body.length);
    body += o;
  }
  const xref = body.length;
  body += `xref\n0 ${objects.length + 1}\n0000000000 65535 f \n${offsets.map((o) => `${String(o).padStart(10, '0')} 00000 n \n`).join('')}`;
  body += `trailer\n<< /Size ${objects.length + 1} /Root 1 0 R >>\nstartxref\n${xref}\n%%EOF\n`;
  return Buffer.from(body, 'latin1');
}

/**
 * A Windows executable's first bytes: the DOS header ("MZ", e_lfanew at 0x3C pointing to the
 * PE header), the DOS stub message, then "PE\0\0" and a COFF header for x86 (machine 0x014C),
 * as laid out in Microsoft's PE Format specification. Padded to 1 KiB like a real header block.
 */
export function windowsExecutable(): Buffer {
  const b = Buffer.alloc(1024);
  b.write('MZ', 0, 'latin1');
  b.writeUInt16LE(0x90, 0x02); // bytes on last page
  b.writeUInt16LE(3, 0x04); // pages in file
  b.writeUInt16LE(4, 0x08); // header size in paragraphs
  b.writeUInt16LE(0xffff, 0x0c); // max extra paragraphs
  b.writeUInt16LE(0xb8, 0x10); // initial SP
  b.writeUInt16LE(0x40, 0x18); // relocation table offset
  b.writeUInt32LE(0x80, 0x3c); // e_lfanew: the PE header's offset
  b.write('This program cannot be run in DOS mode.\r\r\n$', 0x4e, 'latin1');
  b.write('PE\0\0', 0x80, 'latin1');
  b.writeUInt16LE(0x014c, 0x84); // machine: i386
  b.writeUInt16LE(1, 0x86); // number of sections
  b.writeUInt16LE(0xe0, 0x94); // size of optional header
  b.writeUInt16LE(0x0102, 0x96); // characteristics: executable, 32-bit
  b.writeUInt16LE(0x010b, 0x98); // optional header magic: PE32
  return b;
}

/**
 * The owner's car with a co-driver and a granted shop's staff, a run and a tread reading on it;
 * another driver and another shop's staff who see none of it.
 */
export async function attachmentWorld(t: TestApp) {
  const owner = await driverWithCarAndEvent(t);
  const coDriver = await addCoDriver(t, owner);
  const otherDriver = await signedInClient(t, { displayName: 'Ines Calloway' });
  const staff = await signedInClient(t, { displayName: 'Bram Okafor' });
  const q = (sql: string, params: unknown[]) => t.ds.query(sql, params) as Promise<{ id: string }[]>;
  const [shop] = await q(`INSERT INTO shops (name) VALUES ('Corner Weight Works') RETURNING id`, []);
  await q(`INSERT INTO shop_members (shop_id, user_id, is_shop_admin) VALUES ($1, $2, true)`, [shop!.id, staff.user.id]);
  await q(`INSERT INTO shop_grants (car_id, shop_id, granted_by) VALUES ($1, $2, $3)`, [owner.carId, shop!.id, owner.user.id]);
  const run = await owner.c.post('/api/runs', runBody(owner.carId, owner.eventId));
  expect(run.status, JSON.stringify(run.body)).toBe(201);
  const [tyreSet] = await q(`INSERT INTO tyre_sets (car_id, label) VALUES ($1, 'Set A') RETURNING id`, [owner.carId]);
  const [reading] = await q(
    `INSERT INTO tread_readings (tyre_set_id, taken_at, created_by) VALUES ($1, '2026-04-12T12:00:00Z', $2) RETURNING id`,
    [tyreSet!.id, owner.user.id],
  );
  return { owner, coDriver, otherDriver, staff, runId: run.body.id as string, readingId: reading!.id };
}
