import type { FileHandle } from 'node:fs/promises';
import { type FitsCard, type FitsValue, parseCard } from './fits-card.js';
import { FileFormatError } from './types.js';

/** FITS files are made of 2880-byte blocks (FITS Standard 4.0, §3.1); cards are 80 bytes. */
export const BLOCK = 2880;
const CARD = 80;

export interface FitsHeader {
  /** 0-based HDU index (0 = primary), as astropy numbers HDUs. */
  readonly hdu: number;
  /** Byte offset of the header and of the data that follows it. */
  readonly start: number;
  readonly dataStart: number;
  /** Valued keywords, long strings already joined (CONTINUE convention, §4.2.1.2). */
  readonly values: ReadonlyMap<string, FitsValue>;
  /** Card number of each valued keyword, for error messages. */
  readonly cardOf: ReadonlyMap<string, number>;
}

/**
 * Read one header starting at byte `start`, block by block, up to its END card. Throws
 * FileFormatError when the file ends before END or a card cannot be read.
 */
export async function readHeader(
  fh: FileHandle,
  start: number,
  hdu: number,
  fileSize: number,
): Promise<FitsHeader> {
  const values = new Map<string, FitsValue>();
  const cardOf = new Map<string, number>();
  const block = Buffer.alloc(BLOCK);
  let offset = start;
  let cardNumber = 0;
  let open: FitsCard | undefined; // a string card waiting for CONTINUE cards
  let openText = '';
  const flush = () => {
    if (open) values.set(open.keyword, openText);
    open = undefined;
  };
  for (;;) {
    if (offset + BLOCK > fileSize) {
      throw new FileFormatError(
        `HDU ${hdu}: the header has no END card — the file ends after card ${cardNumber} ` +
          `(byte ${fileSize}; headers come in 2880-byte blocks)`,
        { card: cardNumber },
      );
    }
    const { bytesRead } = await fh.read(block, 0, BLOCK, offset);
    if (bytesRead < BLOCK)
      throw new FileFormatError(`HDU ${hdu}: short read in the header at byte ${offset}`);
    offset += BLOCK;
    for (let c = 0; c < BLOCK; c += CARD) {
      cardNumber++;
      const card = parseCard(block.toString('latin1', c, c + CARD), hdu, cardNumber);
      if (card.keyword === 'END') {
        flush();
        return { hdu, start, dataStart: offset, values, cardOf };
      }
      if (card.keyword === 'CONTINUE' && open) {
        openText += card.value as string;
        if (!card.continues) flush();
        continue;
      }
      flush();
      if (card.value === undefined || card.keyword === 'CONTINUE') continue;
      if (typeof card.value === 'string' && card.continues) {
        open = card;
        openText = card.value;
      } else {
        values.set(card.keyword, card.value);
      }
      cardOf.set(card.keyword, card.cardNumber);
    }
  }
}

/** A required integer keyword, or a FileFormatError naming it. */
export function requireInt(h: FitsHeader, key: string, min = 0): number {
  const v = h.values.get(key);
  if (typeof v !== 'number' || !Number.isInteger(v) || v < min) {
    const card = h.cardOf.get(key);
    throw new FileFormatError(
      `HDU ${h.hdu}${card ? `, header card ${card}` : ''}: ${key} must be an integer ≥ ${min}, ` +
        (v === undefined ? 'but it is missing' : `got ${JSON.stringify(v)}`),
      card ? { card } : undefined,
    );
  }
  return v;
}

/** Bytes of the data unit (padded to whole blocks): |BITPIX|/8 · GCOUNT · (PCOUNT + Π NAXISi) (§4.4.1). */
export function dataUnitBytes(h: FitsHeader): number {
  const naxis = requireInt(h, 'NAXIS');
  if (naxis === 0) return 0;
  const bitpix = h.values.get('BITPIX');
  if (![8, 16, 32, 64, -32, -64].includes(bitpix as number)) {
    throw new FileFormatError(
      `HDU ${h.hdu}: BITPIX must be 8, 16, 32, 64, −32 or −64, got ${JSON.stringify(bitpix)}`,
    );
  }
  let n = 1;
  for (let i = 1; i <= naxis; i++) n *= requireInt(h, `NAXIS${i}`);
  const pcount = h.values.has('PCOUNT') ? requireInt(h, 'PCOUNT') : 0;
  const gcount = h.values.has('GCOUNT') ? requireInt(h, 'GCOUNT', 1) : 1;
  const bytes = (Math.abs(bitpix as number) / 8) * gcount * (pcount + n);
  return Math.ceil(bytes / BLOCK) * BLOCK;
}
