// The QR code that opens the order's workroom page, drawn as vector squares (crisp at any print size).
import QRCode from 'qrcode';
import { INK } from './text';

/** Draws the code for `text` in a square of `size` points at (x, y), with the four-module quiet zone
 * the QR standard asks for (ISO/IEC 18004) inside that square. */
export function drawQr(doc: PDFKit.PDFDocument, text: string, x: number, y: number, size: number) {
	// Level M survives a crease or a chalk smudge on a workroom ticket (about 15 % of the code).
	const qr = QRCode.create(text, { errorCorrectionLevel: 'M' });
	const n = qr.modules.size;
	const cell = size / (n + 8);
	const x0 = x + 4 * cell;
	const y0 = y + 4 * cell;
	doc.save().fillColor(INK);
	for (let r = 0; r < n; r++) {
		let c = 0;
		while (c < n) {
			if (!qr.modules.get(r, c)) {
				c++;
				continue;
			}
			// A run of dark modules in a row is one rectangle; the slight overlap hides hairline seams.
			let e = c;
			while (e < n && qr.modules.get(r, e)) e++;
			doc.rect(x0 + c * cell, y0 + r * cell, (e - c) * cell + 0.05, cell + 0.05);
			c = e;
		}
	}
	doc.fill();
	doc.restore();
}
