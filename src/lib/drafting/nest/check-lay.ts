// An independent check of a lay with Clipper's polygon intersection (a different code path from the
// bands the nester uses): which pairs of pieces overlap by more than a tolerance, and which pieces leave
// the strip. Used by the tests and the benchmark; never by the nester itself.
import ClipperLib from 'clipper-lib';
import type { Point } from '../geometry';

export interface LayFault {
	kind: 'overlap' | 'outside';
	a: number;
	b?: number;
	amount: number;
}

/** Pieces shrunk by `tolerance` (grown first by half of `spacing`) must not meet; every point within
 * [0, length] × [0, width] ± tolerance. `scale` turns units into Clipper's integers (1e4 per cm: 1 µm). */
export function layFaults(
	pieces: Point[][],
	width: number,
	length: number,
	tolerance: number,
	scale = 1e4,
	spacing = 0
): LayFault[] {
	const faults: LayFault[] = [];
	pieces.forEach((poly, i) => {
		const out = Math.max(...poly.map((q) => Math.max(-q.x, q.x - length, -q.y, q.y - width)));
		if (out > tolerance) faults.push({ kind: 'outside', a: i, amount: out });
	});
	const shrunk = pieces.map((poly) => {
		const co = new ClipperLib.ClipperOffset(2, 0.25);
		co.AddPath(
			poly.map((q) => ({ X: Math.round(q.x * scale), Y: Math.round(q.y * scale) })),
			// Growing by half the spacing must be the round (Euclidean) offset: a mitre reaches further at a
			// sharp corner and would see a clash that is not there.
			spacing > 0 ? ClipperLib.JoinType.jtRound : ClipperLib.JoinType.jtMiter,
			ClipperLib.EndType.etClosedPolygon
		);
		const res: ClipperLib.Paths = [];
		co.Execute(res, (spacing / 2 - tolerance) * scale);
		return res;
	});
	const box = (paths: ClipperLib.Paths) => {
		let x0 = Infinity,
			y0 = Infinity,
			x1 = -Infinity,
			y1 = -Infinity;
		for (const p of paths)
			for (const q of p)
				((x0 = Math.min(x0, q.X)), (y0 = Math.min(y0, q.Y)), (x1 = Math.max(x1, q.X)), (y1 = Math.max(y1, q.Y)));
		return { x0, y0, x1, y1 };
	};
	const boxes = shrunk.map(box);
	for (let i = 0; i < shrunk.length; i++) {
		for (let j = i + 1; j < shrunk.length; j++) {
			const A = boxes[i];
			const B = boxes[j];
			if (A.x1 <= B.x0 || B.x1 <= A.x0 || A.y1 <= B.y0 || B.y1 <= A.y0) continue;
			const c = new ClipperLib.Clipper();
			c.AddPaths(shrunk[i], ClipperLib.PolyType.ptSubject, true);
			c.AddPaths(shrunk[j], ClipperLib.PolyType.ptClip, true);
			const res: ClipperLib.Paths = [];
			c.Execute(
				ClipperLib.ClipType.ctIntersection,
				res,
				ClipperLib.PolyFillType.pftNonZero,
				ClipperLib.PolyFillType.pftNonZero
			);
			const a = res.reduce((s, p) => s + Math.abs(ClipperLib.Clipper.Area(p)), 0) / scale / scale;
			if (a > 0) faults.push({ kind: 'overlap', a: i, b: j, amount: a });
		}
	}
	return faults;
}
