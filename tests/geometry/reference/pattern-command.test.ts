/**
 * The reference shapes through the `pattern` command itself, as an outside checker runs it: a tube modelled in
 * inches with foam thickness, and a globe cut into gores, each written to pattern.json and to the cutter files
 * (SVG, DXF), which must carry the same outlines as the JSON.
 */
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import DxfParser from 'dxf-parser';
import { afterAll, describe, expect, it } from 'vitest';
import type { PatternDoc, PointMm } from '../../../geometry/pattern/pattern-doc';
import { objFile } from '../../fixtures/reference/model-files';
import { latLongSphere, tube } from '../../fixtures/reference/reference-shapes';
import { expectPatternInvariants, pathLength, runPatternCommand } from './reference-checks';

const work = mkdtempSync(join(tmpdir(), 'reference-command-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

const ringLength = (points: PointMm[]): number => pathLength([...points, points[0]]);

interface DxfEntity { type: string; layer: string; shape?: boolean; vertices?: Array<{ x: number; y: number }> }

/**
 * Reads pattern.dxf back with dxf-parser (a reference reader): $INSUNITS = 4 is millimetres (DXF reference,
 * HEADER section), and every closed polyline on the cut layer (SS_CUT, the writer's layer for outlines)'s perimeter equals the JSON outline perimeter of the piece
 * the sheet plan put there, within 0.01 mm (issue 4, "Checks against published sources").
 */
function expectDxfMatches(dir: string, doc: PatternDoc): void {
  const dxf = new DxfParser().parseSync(readFileSync(join(dir, 'pattern.dxf'), 'utf8')) as unknown as {
    header: Record<string, unknown>;
    entities: DxfEntity[];
  };
  expect(dxf.header.$INSUNITS).toBe(4);
  const plan = JSON.parse(readFileSync(join(dir, 'sheet-plan.json'), 'utf8')) as { placements: Array<{ pieceLabel: string }> };
  const cut = dxf.entities.filter((e) => e.type === 'LWPOLYLINE' && e.shape === true && e.layer === 'SS_CUT');
  expect(cut.length).toBe(plan.placements.length);
  expect(cut.length).toBeGreaterThanOrEqual(doc.pieces.reduce((n, p) => n + p.quantity, 0));
  const perimeter = new Map(doc.pieces.map((p) => [p.label, ringLength(p.outline)]));
  cut.forEach((e, i) => {
    const got = ringLength(e.vertices!.map((v): PointMm => [v.x, v.y]));
    expect(Math.abs(got - perimeter.get(plan.placements[i].pieceLabel)!)).toBeLessThan(0.01);
  });
}

describe('the pattern command on reference shapes', () => {
  it('tube 2.5 in radius, 4 in tall, --units in --thickness 6 --surface inner: a (2π·(63.5 − 6)) × 101.6 mm rectangle', () => {
    // Development of a right circular cylinder: girth × height (descriptive geometry); 1 in = 25.4 mm exactly
    // (international inch, 1959); the n-sided tube's girth at vertex radius ρ is n·2ρ·sin(π/n).
    const n = 60;
    const model = join(work, 'tube-inches.obj');
    writeFileSync(model, objFile(tube(2.5, 4, n, 2)));
    const out = join(work, 'tube-out');
    const r = runPatternCommand([model, '--out', out, '--seams', 'obj', '--units', 'in', '--thickness', '6', '--surface', 'inner', '--format', 'json,svg,dxf']);
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    const doc = JSON.parse(readFileSync(join(out, 'pattern.json'), 'utf8')) as PatternDoc;
    expectPatternInvariants(doc);
    expect(doc.pieces).toHaveLength(1);
    const p = doc.pieces[0];
    expect(p.thickness).toBe(6);
    expect(p.surface).toBe('inner');
    const girth = n * 2 * (2.5 * 25.4 - 6) * Math.sin(Math.PI / n);
    expect(p.area2d).toBeCloseTo(girth * 4 * 25.4, 0);
    // Outline: two rims of the girth and two cut edges of the height.
    expect(ringLength(p.outline)).toBeCloseTo(2 * girth + 2 * 4 * 25.4, 2);
    expect(doc.seams).toHaveLength(1);
    expect(doc.seams[0].pieces).toEqual(['A']);
    for (const l of doc.seams[0].lengths) expect(l).toBeCloseTo(101.6, 3);
    expect(doc.warnings.join(' ')).toMatch(/inner face of 6 mm foam/);
    expectDxfMatches(out, doc);
    expect(readFileSync(join(out, 'pattern.svg'), 'utf8')).toMatch(/width="[\d.]+mm"/);
  });

  it('a globe of radius 100 mm with six gore seams (--seams obj): six gores, πR long, stretch reported and warned', () => {
    // Sinusoidal gores (Snyder, Map Projections — A Working Manual, USGS PP 1395): length πR, width 2πR/N.
    const model = join(work, 'globe.obj');
    writeFileSync(model, objFile(latLongSphere(100, 48, 16, 6)));
    const out = join(work, 'globe-out');
    const r = runPatternCommand([model, '--out', out, '--seams', 'obj', '--format', 'json,dxf']);
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/1 piece templates \(6 to cut\), 6 seams/);
    const doc = JSON.parse(readFileSync(join(out, 'pattern.json'), 'utf8')) as PatternDoc;
    expectPatternInvariants(doc);
    const gore = doc.pieces[0];
    expect(gore.quantity).toBe(6);
    let length = 0;
    for (const a of gore.outline) for (const b of gore.outline) length = Math.max(length, Math.hypot(a[0] - b[0], a[1] - b[1]));
    expect(Math.abs(length - Math.PI * 100)).toBeLessThan((gore.stretch.maxPct / 100) * Math.PI * 100);
    // Over the default 3 % budget, a 60°-wide gore gets a warning and a suggested dart that lowers its stretch.
    expect(gore.stretch.maxPct).toBeGreaterThan(3);
    expect(doc.warnings.some((w) => w.startsWith(`piece ${gore.label} stretches up to`))).toBe(true);
    expect(gore.darts!.length).toBe(1);
    expect(gore.darts![0].stretchAfterPct).toBeLessThan(gore.stretch.maxPct);
    expectDxfMatches(out, doc);
  });
});
