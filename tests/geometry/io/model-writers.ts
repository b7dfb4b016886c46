import type { TriMesh } from '../../../geometry/mesh/tri-mesh';

/**
 * Small writers used only by the tests to make files for round trips. They follow the published layouts:
 * OBJ (Wavefront Appendix B1), STL (3D Systems, StereoLithography Interface Specification, 1989: 80-byte header,
 * uint32 count, 50-byte records of float32 LE) and PLY (Turk 1994, "The PLY Polygon File Format").
 */
export function writeObj(mesh: TriMesh): string {
  const out: string[] = [];
  for (let i = 0; i < mesh.positions.length; i += 3) out.push(`v ${mesh.positions[i]} ${mesh.positions[i + 1]} ${mesh.positions[i + 2]}`);
  for (let i = 0; i < mesh.triangles.length; i += 3) out.push(`f ${mesh.triangles[i] + 1} ${mesh.triangles[i + 1] + 1} ${mesh.triangles[i + 2] + 1}`);
  return out.join('\n') + '\n';
}

export function writeBinaryStl(mesh: TriMesh): Uint8Array {
  const F = mesh.triangles.length / 3;
  const buf = new ArrayBuffer(84 + 50 * F);
  const view = new DataView(buf);
  new Uint8Array(buf).set(new TextEncoder().encode('test mesh'), 0);
  view.setUint32(80, F, true);
  for (let f = 0; f < F; f++) {
    for (let k = 0; k < 3; k++) {
      const v = mesh.triangles[3 * f + k];
      for (let a = 0; a < 3; a++) view.setFloat32(84 + 50 * f + 12 + 12 * k + 4 * a, mesh.positions[3 * v + a], true);
    }
  }
  return new Uint8Array(buf);
}

export function writeAsciiStl(mesh: TriMesh): string {
  const out = ['solid test'];
  for (let f = 0; f < mesh.triangles.length; f += 3) {
    out.push('  facet normal 0 0 0', '    outer loop');
    for (let k = 0; k < 3; k++) {
      const v = 3 * mesh.triangles[f + k];
      out.push(`      vertex ${mesh.positions[v]} ${mesh.positions[v + 1]} ${mesh.positions[v + 2]}`);
    }
    out.push('    endloop', '  endfacet');
  }
  out.push('endsolid test');
  return out.join('\n') + '\n';
}

export function writePly(mesh: TriMesh, format: 'ascii' | 'binary_little_endian' | 'binary_big_endian'): Uint8Array {
  const V = mesh.positions.length / 3;
  const F = mesh.triangles.length / 3;
  const header = [
    'ply',
    `format ${format} 1.0`,
    'comment written by the Sheetsmith test suite',
    `element vertex ${V}`,
    'property double x',
    'property double y',
    'property double z',
    'property uchar quality',
    `element face ${F}`,
    'property list uchar int vertex_indices',
    'element note 1',
    'property short tag',
    'end_header',
  ].join('\n') + '\n';
  if (format === 'ascii') {
    const lines: string[] = [];
    for (let v = 0; v < V; v++) lines.push(`${mesh.positions[3 * v]} ${mesh.positions[3 * v + 1]} ${mesh.positions[3 * v + 2]} 7`);
    for (let f = 0; f < F; f++) lines.push(`3 ${mesh.triangles[3 * f]} ${mesh.triangles[3 * f + 1]} ${mesh.triangles[3 * f + 2]}`);
    lines.push('42');
    return new TextEncoder().encode(header + lines.join('\n') + '\n');
  }
  const little = format === 'binary_little_endian';
  const head = new TextEncoder().encode(header);
  const body = new DataView(new ArrayBuffer(V * 25 + F * 13 + 2));
  let p = 0;
  for (let v = 0; v < V; v++) {
    for (let a = 0; a < 3; a++, p += 8) body.setFloat64(p, mesh.positions[3 * v + a], little);
    body.setUint8(p++, 7);
  }
  for (let f = 0; f < F; f++) {
    body.setUint8(p++, 3);
    for (let k = 0; k < 3; k++, p += 4) body.setInt32(p, mesh.triangles[3 * f + k], little);
  }
  body.setInt16(p, 42, little);
  const out = new Uint8Array(head.length + body.byteLength);
  out.set(head);
  out.set(new Uint8Array(body.buffer), head.length);
  return out;
}
