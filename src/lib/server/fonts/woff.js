// @ts-check
// WOFF 1.0 → the plain font (sfnt) it wraps, after W3C WOFF File Format 1.0, sections 3–5 [from memory]:
// each table inflated with Node's zlib once, instead of by fontkit's JavaScript inflater in every
// document. The glyphs are the same bytes either way. Plain JavaScript so that the benchmark, which runs
// in bare Node, loads fonts through the same code as the ticket.
import { inflateSync } from 'node:zlib';

/** @param {Buffer} woff @returns {Buffer} */
export function woffToSfnt(woff) {
	if (woff.readUInt32BE(0) !== 0x774f4646) throw new Error('Not a WOFF file');
	const flavor = woff.readUInt32BE(4);
	const numTables = woff.readUInt16BE(12);
	const tables = Array.from({ length: numTables }, (_, i) => {
		const at = 44 + i * 20;
		const offset = woff.readUInt32BE(at + 4);
		const compLength = woff.readUInt32BE(at + 8);
		const origLength = woff.readUInt32BE(at + 12);
		const raw = woff.subarray(offset, offset + compLength);
		const data = compLength < origLength ? inflateSync(raw) : raw;
		if (data.length !== origLength) throw new Error('WOFF table length mismatch');
		return { tag: woff.readUInt32BE(at), checksum: woff.readUInt32BE(at + 16), data };
	});
	let entrySelector = 0;
	while (2 ** (entrySelector + 1) <= numTables) entrySelector++;
	const searchRange = 2 ** entrySelector * 16;
	const head = 12 + numTables * 16;
	const out = Buffer.alloc(tables.reduce((n, t) => n + ((t.data.length + 3) & ~3), head));
	out.writeUInt32BE(flavor, 0);
	out.writeUInt16BE(numTables, 4);
	out.writeUInt16BE(searchRange, 6);
	out.writeUInt16BE(entrySelector, 8);
	out.writeUInt16BE(numTables * 16 - searchRange, 10);
	let offset = head;
	tables.forEach((t, i) => {
		out.writeUInt32BE(t.tag, 12 + i * 16);
		out.writeUInt32BE(t.checksum, 16 + i * 16);
		out.writeUInt32BE(offset, 20 + i * 16);
		out.writeUInt32BE(t.data.length, 24 + i * 16);
		t.data.copy(out, offset);
		offset += (t.data.length + 3) & ~3;
	});
	return out;
}
