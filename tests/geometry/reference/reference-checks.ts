/**
 * The outside checker's common tools: build a pattern the way a caller would (bytes → importModel →
 * buildPattern, or the `pattern` command itself), and the invariants every pattern document must hold.
 */
import { spawnSync } from 'node:child_process';
import { resolve } from 'node:path';
import { expect } from 'vitest';
import { importModel } from '../../../geometry/io/import-model';
import { buildPattern, type BuildPatternOptions } from '../../../geometry/pattern/build-pattern';
import type { PatternDoc, PointMm } from '../../../geometry/pattern/pattern-doc';
import type { ModelUnit } from '../../../geometry/units';

const root = resolve(__dirname, '../../..');

/** Pattern of a model file's bytes through the public API, as the command does it. */
export function patternOfFile(
  bytes: Uint8Array | string,
  fileName: string,
  options: BuildPatternOptions & { unit?: ModelUnit } = {},
): PatternDoc {
  const data = typeof bytes === 'string' ? new TextEncoder().encode(bytes) : bytes;
  const { unit, ...build } = options;
  const doc = buildPattern(importModel(data, fileName, { unit }), build);
  // What the command writes is JSON: check the document survives it unchanged (no NaN turned into null).
  expect(JSON.parse(JSON.stringify(doc))).toEqual(doc);
  return doc;
}

/** Runs the `pattern` command as `npm run -s pattern` does (package.json: node --import tsx scripts/pattern.ts). */
export function runPatternCommand(args: string[]): { status: number | null; stdout: string; stderr: string } {
  const r = spawnSync(process.execPath, ['--import', 'tsx', 'scripts/pattern.ts', ...args], {
    cwd: root,
    encoding: 'utf8',
    timeout: 60_000,
  });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

/** Signed area of a closed polygon, shoelace formula (positive counter-clockwise). */
export function shoelaceArea(points: PointMm[]): number {
  let a = 0;
  for (let i = 0; i < points.length; i++) {
    const p = points[i];
    const q = points[(i + 1) % points.length];
    a += p[0] * q[1] - q[0] * p[1];
  }
  return a / 2;
}

export function pathLength(points: PointMm[]): number {
  let s = 0;
  for (let i = 0; i + 1 < points.length; i++) s += Math.hypot(points[i + 1][0] - points[i][0], points[i + 1][1] - points[i][1]);
  return s;
}

function everyNumber(value: unknown, path: string, visit: (n: number, path: string) => void): void {
  if (typeof value === 'number') visit(value, path);
  else if (Array.isArray(value)) value.forEach((v, i) => everyNumber(v, `${path}[${i}]`, visit));
  else if (value && typeof value === 'object') for (const [k, v] of Object.entries(value)) everyNumber(v, `${path}.${k}`, visit);
}

/**
 * The invariants every pattern document must hold whatever the shape (DESIGN.md, "The `pattern` command", and
 * issue 3 points 6–7):
 * - every number finite (no NaN or Infinity anywhere);
 * - piece labels unique; every seam's pieces exist; a seam lists one piece (self-seam) or two;
 * - outlines counter-clockwise (shoelace area > 0), holes clockwise;
 * - area2d equals the area inside the outline minus the holes (the flat pattern is what is cut);
 * - area2d/area3d within the range the reported stretch allows: each triangle's area scales by σ1·σ2, and
 *   |σ − 1| ≤ maxPct/100, so the ratio lies in [(1 − m)², (1 + m)²];
 * - both 2D seam lengths equal the 3D length within the piece stretch (and a small absolute slack), length3d being
 *   measured on the surface the pattern follows;
 * - stations run from 0 to the seam length, strictly increasing, 25 mm apart between the ends when there are
 *   more than the two ends (issue 3 point 7); bevel = |180 − dihedral|/2 (common joinery
 *   practice), min ≤ mean ≤ max, convex iff the mean dihedral is below 180.
 */
export function expectPatternInvariants(doc: PatternDoc): void {
  everyNumber(doc, 'doc', (n, path) => {
    if (!Number.isFinite(n)) throw new Error(`non-finite number at ${path}: ${n}`);
  });
  expect(doc.units).toBe('mm');
  const labels = doc.pieces.map((p) => p.label);
  expect(new Set(labels).size).toBe(labels.length);
  const seamLabels = doc.seams.map((s) => s.label);
  expect(new Set(seamLabels).size).toBe(seamLabels.length);
  const pieceOf = new Map(doc.pieces.map((p) => [p.label, p]));
  for (const p of doc.pieces) {
    expect(shoelaceArea(p.outline), `piece ${p.label} outline counter-clockwise`).toBeGreaterThan(0);
    for (const h of p.holes) expect(shoelaceArea(h), `piece ${p.label} hole clockwise`).toBeLessThan(0);
    const cut = shoelaceArea(p.outline) + p.holes.reduce((s, h) => s + shoelaceArea(h), 0);
    expect(Math.abs(cut - p.area2d) / p.area2d, `piece ${p.label} area2d vs its outline`).toBeLessThan(1e-6);
    const m = p.stretch.maxPct / 100;
    const ratio = p.area2d / p.area3d;
    expect(ratio, `piece ${p.label} area ratio vs stretch`).toBeGreaterThanOrEqual((1 - m) ** 2 - 1e-9);
    expect(ratio, `piece ${p.label} area ratio vs stretch`).toBeLessThanOrEqual((1 + m) ** 2 + 1e-9);
    expect(p.stretch.rmsPct).toBeLessThanOrEqual(p.stretch.maxPct + 1e-9);
    expect(p.quantity).toBeGreaterThanOrEqual(1);
  }
  for (const s of doc.seams) {
    expect(s.pieces.length === 1 || s.pieces.length === 2, `seam ${s.label} pieces`).toBe(true);
    for (const l of s.pieces) expect(pieceOf.has(l), `seam ${s.label} piece ${l} exists`).toBe(true);
    expect(s.lengths).toHaveLength(2);
    const m = Math.max(...s.pieces.map((l) => pieceOf.get(l)!.stretch.maxPct)) / 100;
    for (const l of s.lengths) {
      expect(Math.abs(l - s.length3d), `seam ${s.label} 2D length ${l} vs 3D ${s.length3d}`).toBeLessThanOrEqual(
        m * s.length3d + 1e-6 * s.length3d,
      );
    }
    expect(s.dihedral.min).toBeLessThanOrEqual(s.dihedral.mean + 1e-9);
    expect(s.dihedral.mean).toBeLessThanOrEqual(s.dihedral.max + 1e-9);
    expect(s.bevel.min).toBeLessThanOrEqual(s.bevel.mean + 1e-9);
    expect(s.bevel.mean).toBeLessThanOrEqual(s.bevel.max + 1e-9);
    expect(s.convex).toBe(s.dihedral.mean < 180);
    expect(s.stations.length).toBeGreaterThanOrEqual(2);
    expect(s.stations[0].at).toBe(0);
    expect(s.stations[s.stations.length - 1].at).toBeCloseTo(s.length3d, 9);
    for (let i = 1; i < s.stations.length; i++) expect(s.stations[i].at).toBeGreaterThan(s.stations[i - 1].at);
    for (let i = 1; i + 1 < s.stations.length; i++) expect(s.stations[i].at).toBeCloseTo(25 * i, 9);
    for (const st of s.stations) {
      if (st.dihedral !== undefined) expect(st.bevel).toBeCloseTo(Math.abs(180 - st.dihedral) / 2, 9);
      expect(st.bevel).toBeGreaterThanOrEqual(s.bevel.min - 1e-9);
      expect(st.bevel).toBeLessThanOrEqual(s.bevel.max + 1e-9);
    }
  }
}

/** Angle of the corner at points[i] inside a counter-clockwise polygon, degrees in (0, 360). */
export function interiorAngleDeg(poly: PointMm[], i: number): number {
  const v = poly[i];
  const p = poly[(i + poly.length - 1) % poly.length];
  const n = poly[(i + 1) % poly.length];
  const ax = n[0] - v[0], ay = n[1] - v[1];
  const bx = p[0] - v[0], by = p[1] - v[1];
  let a = (Math.atan2(ax * by - ay * bx, ax * bx + ay * by) * 180) / Math.PI;
  if (a < 0) a += 360;
  return a;
}
