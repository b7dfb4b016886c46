/**
 * Checks made before a sculpt upload leaves the machine (hooks/use-upload.ts). The 200 MB limit and the
 * OBJ/STL/PLY formats are DESIGN.md step 1 ("Sculpt in"); sizes use binary multiples (IEC 80000-13 kibi/mebi,
 * shown as kB/MB as common practice in file dialogs).
 */
import { describe, expect, it } from 'vitest';
import { checkSculptFile, formatBytes, MAX_SCULPT_BYTES, uploadFormFields } from '../../hooks/use-upload';

describe('checkSculptFile', () => {
  it('accepts .obj, .stl and .ply in any case up to 200 MB', () => {
    expect(checkSculptFile('helm.obj', 1)).toBeNull();
    expect(checkSculptFile('HELM.STL', MAX_SCULPT_BYTES)).toBeNull();
    expect(checkSculptFile('scan.v2.Ply', 5_000)).toBeNull();
  });
  it('names the file and the problem for a wrong type, an empty file and an oversized one', () => {
    expect(checkSculptFile('helm.fbx', 100)).toMatch(/“helm\.fbx”.*\.obj, \.stl or \.ply.*ends in \.fbx/);
    expect(checkSculptFile('helm', 100)).toMatch(/“helm” is not a model file/);
    expect(checkSculptFile('helm.obj', 0)).toMatch(/“helm\.obj” is empty/);
    expect(checkSculptFile('scan.stl', MAX_SCULPT_BYTES + 1)).toMatch(/“scan\.stl” is 200\.0 MB; the most a sculpt may be is 200\.0 MB/);
  });
});

describe('formatBytes', () => {
  it('uses powers of 1024 with one decimal', () => {
    expect(formatBytes(812)).toBe('812 B');
    expect(formatBytes(1536)).toBe('1.5 kB');
    expect(formatBytes(3.4 * 1024 * 1024)).toBe('3.4 MB');
  });
});

describe('uploadFormFields', () => {
  it('sends the units and only the numbers that were given, as decimal text', () => {
    expect(uploadFormFields({ units: 'cm' })).toEqual([['units', 'cm']]);
    expect(uploadFormFields({ units: 'mm', headCircumferenceMm: 570, headHeightMm: 232.5 })).toEqual([
      ['units', 'mm'],
      ['headCircumferenceMm', '570'],
      ['headHeightMm', '232.5'],
    ]);
  });
});
