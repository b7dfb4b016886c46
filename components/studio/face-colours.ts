/**
 * Per-face colours of the studio's 3D view: pieces in distinct colours, and the stretch map on Sheetsmith's own
 * ramp (pale sage where the foam lies flat, sand at the stretch budget, ember and then deep red past it).
 */

type Rgb = [number, number, number];

/** Stops of the stretch ramp as [share of the ramp's range, colour 0–1]; the range is 0 … 2 × budget. */
export const STRETCH_RAMP: ReadonlyArray<readonly [number, Rgb]> = [
  [0, [0.86, 0.9, 0.82]],
  [0.25, [0.62, 0.74, 0.56]],
  [0.5, [0.85, 0.7, 0.42]],
  [0.75, [0.8, 0.4, 0.15]],
  [1, [0.55, 0.1, 0.1]],
];

/** CSS colour of an RGB triple in 0–1. */
export function rgbCss([r, g, b]: readonly number[]): string {
  const h = (x: number) => Math.round(Math.max(0, Math.min(1, x)) * 255).toString(16).padStart(2, '0');
  return `#${h(r)}${h(g)}${h(b)}`;
}

/**
 * Colour of a face whose foam must stretch `pct` percent when the budget is `budgetPct` (> 0): linear between
 * the STRETCH_RAMP stops over 0 … 2·budget, clamped beyond. Returns RGB in 0–1.
 */
export function stretchColour(pct: number, budgetPct: number): Rgb {
  const t = Math.max(0, Math.min(1, Math.abs(pct) / (2 * budgetPct)));
  for (let i = 1; i < STRETCH_RAMP.length; i++) {
    const [t1, c1] = STRETCH_RAMP[i];
    if (t <= t1) {
      const [t0, c0] = STRETCH_RAMP[i - 1];
      const u = (t - t0) / (t1 - t0);
      return [c0[0] + u * (c1[0] - c0[0]), c0[1] + u * (c1[1] - c0[1]), c0[2] + u * (c1[2] - c0[2])];
    }
  }
  return [...STRETCH_RAMP[STRETCH_RAMP.length - 1][1]] as Rgb;
}

function hslToRgb(h: number, s: number, l: number): Rgb {
  const k = (n: number) => (n + h / 30) % 12;
  const a = s * Math.min(l, 1 - l);
  const f = (n: number) => l - a * Math.max(-1, Math.min(k(n) - 3, Math.min(9 - k(n), 1)));
  return [f(0), f(8), f(4)];
}

/**
 * Colour of piece `index` (0-based): hues stepped by the golden angle (≈137.5°) so neighbours in the list stay
 * far apart on the colour wheel, at muted saturation and two alternating lightnesses so many pieces stay
 * distinguishable. Returns RGB in 0–1.
 */
export function pieceColour(index: number): Rgb {
  const hue = (30 + index * 137.508) % 360;
  return hslToRgb(hue, 0.42, index % 2 === 0 ? 0.66 : 0.56);
}

/** Colour of the sculpt's skin before there are pieces (foam-sand grey). */
export const PLAIN_SKIN: Rgb = [0.83, 0.8, 0.74];

/**
 * Fills `out` (Float32Array(9F), three identical RGB corners per face, the layout of a non-indexed geometry) for
 * every face: by piece (`pieceIndex` Int32Array(F), −1 none) or by stretch (`stretchPct` Float32Array(F)) when
 * `mode` is 'stretch'. A `selected` piece index keeps its colour and the other pieces are faded toward grey.
 */
export function fillFaceColours(
  out: Float32Array,
  faceCount: number,
  mode: 'plain' | 'pieces' | 'stretch',
  faces: { pieceIndex: Int32Array; stretchPct: Float32Array } | null,
  budgetPct: number,
  selected: number | null,
): void {
  const palette = new Map<number, Rgb>();
  for (let f = 0; f < faceCount; f++) {
    let c: Rgb = PLAIN_SKIN;
    const piece = faces && f < faces.pieceIndex.length ? faces.pieceIndex[f] : -1;
    if (faces && mode === 'stretch' && f < faces.stretchPct.length) c = stretchColour(faces.stretchPct[f], budgetPct);
    else if (mode !== 'plain' && piece >= 0) {
      c = palette.get(piece) ?? pieceColour(piece);
      palette.set(piece, c);
    }
    if (selected !== null && piece !== selected) c = [0.25 * c[0] + 0.6, 0.25 * c[1] + 0.6, 0.25 * c[2] + 0.6];
    for (let k = 0; k < 3; k++) {
      out[9 * f + 3 * k] = c[0];
      out[9 * f + 3 * k + 1] = c[1];
      out[9 * f + 3 * k + 2] = c[2];
    }
  }
}
