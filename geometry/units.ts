/**
 * Branded number types that keep units apart at compile time and cost nothing at run time.
 * A plain `number` must be converted explicitly (`mm(3)`, `deg(30)`), so millimetres never
 * mix with PDF points and degrees never mix with radians by accident.
 */
declare const unit: unique symbol;
type Brand<T, U extends string> = T & { readonly [unit]: U };

/** A length in millimetres (the unit every stored length uses). */
export type Mm = Brand<number, 'mm'>;
/** A length in PDF points, 1/72 inch (ISO 32000-1 §8.3.2.3). */
export type Pt = Brand<number, 'pt'>;
/** An angle in degrees (the unit shown to people). */
export type Deg = Brand<number, 'deg'>;
/** An angle in radians (the unit the maths uses). */
export type Rad = Brand<number, 'rad'>;

export const mm = (v: number): Mm => v as Mm;
export const pt = (v: number): Pt => v as Pt;
export const deg = (v: number): Deg => v as Deg;
export const rad = (v: number): Rad => v as Rad;

/** Millimetres per inch, exact by definition (international inch, 1959). */
export const MM_PER_INCH = 25.4;

/** Converts millimetres to PDF points (72 pt per inch). */
export const mmToPt = (v: Mm): Pt => pt((v / MM_PER_INCH) * 72);
/** Converts PDF points to millimetres. */
export const ptToMm = (v: Pt): Mm => mm((v / 72) * MM_PER_INCH);
/** Converts radians to degrees. */
export const radToDeg = (v: Rad): Deg => deg((v * 180) / Math.PI);
/** Converts degrees to radians. */
export const degToRad = (v: Deg): Rad => rad((v * Math.PI) / 180);

/** Model-file units the importer understands, with their size in millimetres. */
export const MODEL_UNIT_MM = { mm: 1, cm: 10, m: 1000, in: MM_PER_INCH } as const;
export type ModelUnit = keyof typeof MODEL_UNIT_MM;
