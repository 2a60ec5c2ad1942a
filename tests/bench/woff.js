// @ts-check
// WOFF 1 → plain TrueType (sfnt), with Node's native zlib, so the ticket floor loads Lora the way the
// ticket code does (src/lib/server/ticket/fonts.ts converts once for the same reason: fontkit would
// otherwise inflate every table in JavaScript for each new document). Layout per WOFF File Format
// 1.0, W3C Recommendation 2012, sections 3–5 [from memory].
import { inflateSync } from 'node:zlib';

/** @param {Buffer} woff */
export function woffToSfnt(woff) {
	if (woff.readUInt32BE(0) !== 0x774f4646) throw new Error('not a WOFF 1 file');
	const flavor = woff.readUInt32BE(4);
	const numTables = woff.readUInt16BE(12);
	const tables = [];
	for (let i = 0; i < numTables; i++) {
		const at = 44 + i * 20;
		const [tag, offset, compLength, origLength, checksum] = [0, 4, 8, 12, 16].map((k) => woff.readUInt32BE(at + k));
		const raw = woff.subarray(offset, offset + compLength);
		const data = compLength < origLength ? inflateSync(raw) : raw;
		if (data.length !== origLength) throw new Error('WOFF table length mismatch');
		tables.push({ tag, checksum, data });
	}
	let pow = 1;
	let log = 0;
	while (pow * 2 <= numTables) ((pow *= 2), log++);
	const head = Buffer.alloc(12 + 16 * numTables);
	head.writeUInt32BE(flavor, 0);
	head.writeUInt16BE(numTables, 4);
	head.writeUInt16BE(pow * 16, 6);
	head.writeUInt16BE(log, 8);
	head.writeUInt16BE(numTables * 16 - pow * 16, 10);
	const parts = [head];
	let offset = head.length;
	tables.forEach((t, i) => {
		const rec = 12 + i * 16;
		head.writeUInt32BE(t.tag, rec);
		head.writeUInt32BE(t.checksum, rec + 4);
		head.writeUInt32BE(offset, rec + 8);
		head.writeUInt32BE(t.data.length, rec + 12);
		const padded = Buffer.alloc((t.data.length + 3) & ~3);
		t.data.copy(padded);
		parts.push(padded);
		offset += padded.length;
	});
	return Buffer.concat(parts);
}
