import { createHash } from 'node:crypto';
import { afterAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { readFileFor } from '@/lib/files/access';
import { FILE_KINDS } from '@/lib/files/sniff';
import { readFile, storeFile } from '@/lib/files/store';
import { binaryStlChunks, cubeMesh, makeBinaryStl } from '@/lib/plating';
import { customerIdByCode, inRolledBackTransaction, refusalOf, sessionUserByEmail } from '../records/helpers';

afterAll(() => db.destroy());

const PDF = new TextEncoder().encode('%PDF-1.4\n1 0 obj << /Type /Catalog >> endobj\ntrailer << >>\n%%EOF\n');

function streamOf(chunks: Iterable<Uint8Array>): ReadableStream<Uint8Array> {
  const it = chunks[Symbol.iterator]();
  return new ReadableStream({
    pull(controller) {
      const next = it.next();
      if (next.done) controller.close();
      else controller.enqueue(next.value);
    },
  });
}


describe('storeFile', () => {
  it('keeps the bytes with their SHA-256 and sniffed type', async () => {
    await inRolledBackTransaction(async (trx) => {
      const owner = await sessionUserByEmail('owner@kestrel-plating.test');
      const stored = await storeFile({ name: 'C:\\fakepath\\bracket drawing.pdf', bytes: PDF, declaredType: 'application/pdf', allowed: FILE_KINDS.drawing, uploadedBy: owner.id }, trx);
      expect(stored).toMatchObject({ name: 'bracket drawing.pdf', kind: 'pdf', contentType: 'application/pdf', sizeBytes: PDF.length, stl: null });
      // Source: Node's crypto SHA-256 (FIPS 180-4) over the same bytes.
      expect(stored.sha256).toBe(createHash('sha256').update(PDF).digest('hex'));
      const back = await readFile(stored.id, trx);
      expect(Buffer.compare(back!.bytes, Buffer.from(PDF))).toBe(0);
      expect(back!.created_at).toBeInstanceOf(Date);
    });
  });

  it('streams a binary STL chunk by chunk and analyses it', async () => {
    await inRolledBackTransaction(async (trx) => {
      const cube = cubeMesh(20);
      // Odd-sized pieces so records and the header straddle chunk boundaries.
      const whole = Buffer.concat([...binaryStlChunks(cube, { header: 'solid cube', trianglesPerChunk: 5 })]);
      const chunks = Array.from({ length: Math.ceil(whole.length / 37) }, (_, i) => whole.subarray(i * 37, i * 37 + 37));
      const stored = await storeFile({ name: 'cube.stl', stream: streamOf(chunks), allowed: FILE_KINDS.stl, uploadedBy: null, stl: { unit: 'mm', densityGPerCm3: 7.85 } }, trx);
      expect(stored.kind).toBe('stl');
      // A 20 mm cube: area 6·20² = 2400 mm² = 0.24 dm²; volume 8 cm³; 8 × 7.85 = 62.8 g (geometry by hand).
      expect(stored.stl!.areaDm2).toBeCloseTo(0.24, 10);
      expect(stored.stl!.volumeCm3).toBeCloseTo(8, 10);
      expect(stored.stl!.weightG).toBeCloseTo(62.8, 10);
      expect(stored.sizeBytes).toBe(84 + 50 * 12);
    });
  });

  it('refuses an oversized stream, a mismatch, an empty file and a broken STL, and writes nothing', async () => {
    await inRolledBackTransaction(async (trx) => {
      const before = (await trx.selectFrom('files').select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow()).n;
      const big = streamOf(Array.from({ length: 40 }, () => new Uint8Array(1000).fill(65)));
      expect(await refusalOf(storeFile({ name: 'big.txt', stream: big, maxBytes: 10_000, allowed: FILE_KINDS.csv, uploadedBy: null }, trx))).toBe(
        'TOO_LARGE: "big.txt" is larger than the 9.8 KB limit for this upload.',
      );
      expect(await refusalOf(storeFile({ name: 'drawing.png', bytes: PDF, allowed: FILE_KINDS.drawing, uploadedBy: null }, trx))).toMatch(
        /^BAD_INPUT: "drawing.png" is named .png but its content is a PDF document/,
      );
      expect(await refusalOf(storeFile({ name: 'nothing.pdf', bytes: new Uint8Array(), allowed: FILE_KINDS.drawing, uploadedBy: null }, trx))).toBe(
        'BAD_INPUT: "nothing.pdf" is empty.',
      );
      const stl = makeBinaryStl(cubeMesh(5));
      const cut = stl.subarray(0, stl.length - 10);
      expect(await refusalOf(storeFile({ name: 'cut.stl', bytes: cut, allowed: FILE_KINDS.stl, uploadedBy: null }, trx))).toMatch(/^BAD_INPUT: "cut.stl" is not/);
      const after = (await trx.selectFrom('files').select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow()).n;
      expect(after).toBe(before);
    });
  });
});

describe('readFileFor', () => {
  it('gives a customer only files on its own records, and staff through the record or their own upload', async () => {
    await inRolledBackTransaction(async (trx) => {
      const [owner, plater, estimator, ngfBuyer, hviQuality] = await Promise.all(
        ['owner', 'plater', 'estimator'].map((r) => sessionUserByEmail(`${r}@kestrel-plating.test`)).concat([
          sessionUserByEmail('buyer@northgate-fastener.test'),
          sessionUserByEmail('quality@halvorsen-valve.test'),
        ]),
      );
      const drawing = await storeFile({ name: 'ngf.pdf', bytes: PDF, allowed: FILE_KINDS.drawing, uploadedBy: owner!.id }, trx);
      const loose = await storeFile({ name: 'loose.pdf', bytes: PDF, allowed: FILE_KINDS.drawing, uploadedBy: owner!.id }, trx);
      const ngf = await customerIdByCode('NGF', trx);
      await trx.updateTable('parts').set({ drawing_file_id: drawing.id }).where('customer_id', '=', ngf).where('part_number', '=', 'NGF-HX-0816').execute();

      expect((await readFileFor(ngfBuyer!, drawing.id, trx))?.name).toBe('ngf.pdf');
      expect(await readFileFor(hviQuality!, drawing.id, trx)).toBeNull();
      expect(await readFileFor(ngfBuyer!, loose.id, trx)).toBeNull();
      expect((await readFileFor(plater!, drawing.id, trx))?.id).toBe(drawing.id);
      expect(await readFileFor(estimator!, loose.id, trx)).toBeNull(); // not attached, not theirs
      expect((await readFileFor(owner!, loose.id, trx))?.id).toBe(loose.id); // their own upload
      expect(await readFileFor(owner!, 'not-a-uuid', trx)).toBeNull();
      expect(await readFileFor({ ...ngfBuyer!, customerId: null }, drawing.id, trx)).toBeNull();
    });
  });
});
