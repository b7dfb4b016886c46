import { afterEach, describe, expect, it, vi } from 'vitest';
import { ApiError, fetchBytes } from '../../hooks/api-client';
import { decodeWorkingMesh } from '../../geometry/io/working-mesh';

// The binary layout is the working-mesh format of CONTRACTS.md ("SSWM", u32 version 1, u32 vertex count,
// u32 triangle count, f32 positions in mm, u32 indices, little-endian), written here byte by byte rather than
// with the project's encoder, so the client is checked against the contract. The error body shape
// `{ error: { code, message } }` is the API contract of issue 2; status 0 for an unreachable server is this
// client's own convention (hooks/api-client.ts ApiError).

/** One triangle (0,0,0) (10,0,0) (0,20,0) mm in the contract's layout. */
function oneTriangleFile(): Uint8Array<ArrayBuffer> {
  const buf = new ArrayBuffer(16 + 9 * 4 + 3 * 4);
  const view = new DataView(buf);
  'SSWM'.split('').forEach((c, i) => view.setUint8(i, c.charCodeAt(0)));
  view.setUint32(4, 1, true);
  view.setUint32(8, 3, true);
  view.setUint32(12, 1, true);
  [0, 0, 0, 10, 0, 0, 0, 20, 0].forEach((v, i) => view.setFloat32(16 + i * 4, v, true));
  [0, 1, 2].forEach((v, i) => view.setUint32(52 + i * 4, v, true));
  return new Uint8Array(buf);
}

function respondWith(response: () => Response) {
  const fetchMock = vi.fn(async () => response());
  vi.stubGlobal('fetch', fetchMock);
  return fetchMock;
}

afterEach(() => {
  vi.unstubAllGlobals();
});

describe('fetchBytes', () => {
  it('GETs the file with the session cookie, asking for bytes, and decodes it', async () => {
    const bytes = oneTriangleFile();
    const fetchMock = respondWith(() => new Response(bytes, { status: 200, headers: { 'Content-Type': 'application/octet-stream' } }));
    const mesh = await fetchBytes('/api/mesh', decodeWorkingMesh, "The sculpt's working mesh");
    const [url, init] = fetchMock.mock.calls[0] as unknown as [string, RequestInit];
    expect(url).toBe('/api/mesh');
    expect(init.credentials).toBe('same-origin');
    expect((init.headers as Record<string, string>).Accept).toBe('application/octet-stream');
    expect(Array.from(mesh.positions)).toEqual([0, 0, 0, 10, 0, 0, 0, 20, 0]);
    expect(Array.from(mesh.triangles)).toEqual([0, 1, 2]);
  });

  it('throws the server error of a 404 with its code and message', async () => {
    respondWith(() => new Response(JSON.stringify({ error: { code: 'NOT_FOUND', message: 'No sculpt 7 in this build.' } }), { status: 404, headers: { 'Content-Type': 'application/json' } }));
    const err = await fetchBytes('/api/mesh', decodeWorkingMesh, "The sculpt's working mesh").catch((e: unknown) => e);
    expect(err).toBeInstanceOf(ApiError);
    expect(err).toMatchObject({ status: 404, code: 'NOT_FOUND', message: 'No sculpt 7 in this build.' });
  });

  it('reports a truncated file as BAD_RESPONSE naming the file and what the decoder found', async () => {
    respondWith(() => new Response(oneTriangleFile().slice(0, 30), { status: 200 }));
    const err = await fetchBytes('/api/mesh', decodeWorkingMesh, "The sculpt's working mesh").catch((e: unknown) => e);
    expect(err).toBeInstanceOf(ApiError);
    expect((err as ApiError).code).toBe('BAD_RESPONSE');
    expect((err as ApiError).message).toMatch(/^The sculpt's working mesh could not be read: .+/);
  });

  it('reports an unreachable server as NETWORK with status 0', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => Promise.reject(new TypeError('Failed to fetch'))));
    await expect(fetchBytes('/api/mesh', decodeWorkingMesh, 'The file')).rejects.toMatchObject({ status: 0, code: 'NETWORK' });
  });
});
