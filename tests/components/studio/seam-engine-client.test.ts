/**
 * The seam engine's page fallback (used where a web worker cannot start): same answers as the engine itself,
 * and a cancel that rejects the request still waiting. Expected path lengths from the grid's construction
 * (1 mm cells: n cells straight is n mm).
 */
import { describe, expect, it } from 'vitest';
import { SeamRequestCancelled, startSeamEngine } from '../../../components/studio/seam-engine-client';
import { uvSphere } from '../../../geometry/shapes';

function strip(n: number) {
  const positions: number[] = [];
  const triangles: number[] = [];
  for (let j = 0; j <= 1; j++) for (let i = 0; i <= n; i++) positions.push(i, j, 0);
  for (let i = 0; i < n; i++) triangles.push(i, i + 1, n + 2 + i, i, n + 2 + i, n + 1 + i);
  return { positions: Float32Array.from(positions), triangles: Uint32Array.from(triangles) };
}

describe('seam engine on the page', () => {
  it('answers a path request along the bottom edge of a strip: 0 → 8 is the 9 vertices 0…8', async () => {
    const m = strip(8);
    const engine = startSeamEngine(m.positions, m.triangles, () => null);
    expect(engine.inWorker).toBe(false);
    expect(await engine.ask({ kind: 'path', from: 0, to: 8 })).toEqual([0, 1, 2, 3, 4, 5, 6, 7, 8]);
    await expect(engine.ask({ kind: 'path', from: 0, to: 99 })).rejects.toThrow(/seam end vertex 99 is not in the mesh/);
    engine.dispose();
  });

  it('finds the mirror plane of a sphere and rejects a cancelled request', async () => {
    const s = uvSphere(20, 16, 8);
    const engine = startSeamEngine(Float32Array.from(s.positions), s.triangles, () => null);
    const plane = await engine.ask({ kind: 'symmetry' });
    expect(plane).not.toBeNull();
    // A sphere centred on the origin is symmetric in planes through its centre: offset 0 (construction).
    expect(Math.abs(plane!.offsetMm)).toBeLessThan(1e-6);
    const pending = engine.ask({ kind: 'creases', minDeviationDeg: 40 });
    engine.cancel();
    await expect(pending).rejects.toBeInstanceOf(SeamRequestCancelled);
    engine.dispose();
  });
});
