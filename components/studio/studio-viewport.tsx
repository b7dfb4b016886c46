/**
 * The studio's 3D view: the working mesh coloured plain, by piece or by stretch, the seams as ink lines (the seam
 * being drawn in ember, suggestions dashed in violet), seam badges, and orbit / zoom / pan with mouse and touch.
 * Picking uses a bounding-volume hierarchy over the triangles (three-mesh-bvh), so a click on a dense sculpt
 * answers at once. Loaded only by the studio (lazy), so three.js stays out of every other page's code.
 */
import { Canvas, useFrame, useThree, type ThreeEvent } from '@react-three/fiber';
import { Line } from '@react-three/drei/core/Line';
import { OrbitControls } from '@react-three/drei/core/OrbitControls';
import { Html } from '@react-three/drei/web/Html';
import { useEffect, useMemo, useRef } from 'react';
import * as THREE from 'three';
import { acceleratedRaycast, computeBoundsTree, disposeBoundsTree } from 'three-mesh-bvh';
import type { SeamLine } from '../../db/schema-sculpts';
import type { WorkingMesh } from '../../geometry/io/working-mesh';
import { fillFaceColours } from './face-colours';
import type { SeamBadge } from './seam-badges';

THREE.BufferGeometry.prototype.computeBoundsTree = computeBoundsTree;
THREE.BufferGeometry.prototype.disposeBoundsTree = disposeBoundsTree;
THREE.Mesh.prototype.raycast = acceleratedRaycast;

/** A click on the model: the face hit, the vertex of that face nearest the hit, and the hit point (mm). */
export interface SurfacePick {
  face: number;
  vertex: number;
  point: [number, number, number];
}

export interface StudioViewportProps {
  mesh: WorkingMesh;
  seams: readonly SeamLine[];
  /** The seam being drawn (vertex path), shown in ember. */
  draft: readonly number[];
  /** Suggested seam lines not yet accepted, shown dashed. */
  candidates: readonly (readonly number[])[];
  colourMode: 'plain' | 'pieces' | 'stretch';
  faces: { pieceIndex: Int32Array; stretchPct: Float32Array } | null;
  stretchBudgetPct: number;
  selectedPiece: number | null;
  badges: readonly SeamBadge[];
  onPick(pick: SurfacePick): void;
  /** Accessible description of what the view shows (seam and piece counts). */
  description: string;
}

/** Ink of saved seams, ember of the seam being drawn, violet of suggestions (ours). */
const SEAM_INK = '#1f1a17';
const DRAFT_INK = '#c2410c';
const CANDIDATE_INK = '#6d28d9';

/** Pointer travel (px) beyond which a press is an orbit drag, not a pick. */
const DRAG_PX = 5;

/**
 * Renders the canvas. `onPick` is called for a click (not a drag) on the model with the nearest vertex of the
 * face hit. The first frame drawn with the mesh is marked as the performance mark "studio-first-mesh-frame".
 */
export default function StudioViewport(props: StudioViewportProps) {
  const { mesh } = props;
  const frame = useMemo(() => {
    const g = new THREE.BufferGeometry();
    g.setAttribute('position', new THREE.BufferAttribute(mesh.positions, 3));
    g.computeBoundingSphere();
    const s = g.boundingSphere!;
    g.dispose();
    return { center: s.center.clone(), radius: Math.max(s.radius, 1e-3) };
  }, [mesh]);
  const c = frame.center;
  const r = frame.radius;
  return (
    <Canvas
      frameloop="demand"
      dpr={[1, 2]}
      // The drawn frame is kept so the "Cover picture" tool can read it back between frames.
      gl={{ preserveDrawingBuffer: true }}
      onCreated={({ gl }) => gl.domElement.setAttribute('data-studio-view', '')}
      camera={{ position: [c.x, c.y - 3 * r, c.z], up: [0, 0, 1], near: r / 200, far: r * 50, fov: 40 }}
      style={{ touchAction: 'none' }}
      aria-label={props.description}
      role="img"
    >
      <color attach="background" args={['#efe6d7']} />
      <hemisphereLight args={['#fffaf0', '#5e544b', 1.1]} />
      <directionalLight position={[c.x + r, c.y - 2 * r, c.z + 3 * r]} intensity={1.4} />
      <SculptSurface {...props} />
      <SeamLines mesh={mesh} seams={props.seams} draft={props.draft} candidates={props.candidates} lift={r * 0.002} />
      <Badges badges={props.badges} />
      <OrbitControls makeDefault target={[c.x, c.y, c.z]} enableDamping={false} />
      <FitCamera center={c} radius={r} />
      <FirstFrameMark />
    </Canvas>
  );
}

function SculptSurface({ mesh, colourMode, faces, stretchBudgetPct, selectedPiece, onPick }: StudioViewportProps) {
  const faceCount = mesh.triangles.length / 3;
  const geometry = useMemo(() => {
    const indexed = new THREE.BufferGeometry();
    indexed.setAttribute('position', new THREE.BufferAttribute(mesh.positions, 3));
    indexed.setIndex(new THREE.BufferAttribute(mesh.triangles, 1));
    indexed.computeVertexNormals();
    // Faces are coloured one by one (pieces, stretch), so each face gets its own three corners.
    const g = indexed.toNonIndexed();
    indexed.dispose();
    g.setAttribute('color', new THREE.BufferAttribute(new Float32Array(9 * faceCount), 3));
    g.computeBoundsTree();
    return g;
  }, [mesh, faceCount]);
  useEffect(() => () => geometry.dispose(), [geometry]);
  const invalidate = useThree((s) => s.invalidate);
  useEffect(() => {
    const colours = geometry.getAttribute('color') as THREE.BufferAttribute;
    fillFaceColours(colours.array as Float32Array, faceCount, colourMode, faces, stretchBudgetPct, selectedPiece);
    colours.needsUpdate = true;
    invalidate();
  }, [geometry, faceCount, colourMode, faces, stretchBudgetPct, selectedPiece, invalidate]);
  const down = useRef<{ x: number; y: number } | null>(null);
  const onClick = (e: ThreeEvent<MouseEvent>) => {
    const start = down.current;
    if (start && Math.hypot(e.nativeEvent.clientX - start.x, e.nativeEvent.clientY - start.y) > DRAG_PX) return;
    if (e.faceIndex === undefined || e.faceIndex === null) return;
    e.stopPropagation();
    const f = e.faceIndex;
    const P = mesh.positions;
    let best = -1;
    let bestD = Infinity;
    for (let k = 0; k < 3; k++) {
      const v = mesh.triangles[3 * f + k];
      const d = Math.hypot(P[3 * v] - e.point.x, P[3 * v + 1] - e.point.y, P[3 * v + 2] - e.point.z);
      if (d < bestD) {
        bestD = d;
        best = v;
      }
    }
    onPick({ face: f, vertex: best, point: [e.point.x, e.point.y, e.point.z] });
  };
  return (
    <mesh
      geometry={geometry}
      onPointerDown={(e) => {
        down.current = { x: e.nativeEvent.clientX, y: e.nativeEvent.clientY };
      }}
      onClick={onClick}
    >
      <meshStandardMaterial vertexColors roughness={0.85} metalness={0} polygonOffset polygonOffsetFactor={1} polygonOffsetUnits={1} side={THREE.DoubleSide} />
    </mesh>
  );
}

/** Segment end points of vertex paths, each lifted a little along its vertex normal so lines sit on the skin. */
function segmentPoints(mesh: WorkingMesh, normals: Float32Array, paths: readonly (readonly number[])[], lift: number): THREE.Vector3[] {
  const P = mesh.positions;
  const at = (v: number) => new THREE.Vector3(P[3 * v] + lift * normals[3 * v], P[3 * v + 1] + lift * normals[3 * v + 1], P[3 * v + 2] + lift * normals[3 * v + 2]);
  const pts: THREE.Vector3[] = [];
  for (const p of paths) for (let i = 1; i < p.length; i++) pts.push(at(p[i - 1]), at(p[i]));
  return pts;
}

function SeamLines({
  mesh,
  seams,
  draft,
  candidates,
  lift,
}: {
  mesh: WorkingMesh;
  seams: readonly SeamLine[];
  draft: readonly number[];
  candidates: readonly (readonly number[])[];
  lift: number;
}) {
  const normals = useMemo(() => {
    const g = new THREE.BufferGeometry();
    g.setAttribute('position', new THREE.BufferAttribute(mesh.positions, 3));
    g.setIndex(new THREE.BufferAttribute(mesh.triangles, 1));
    g.computeVertexNormals();
    const n = (g.getAttribute('normal') as THREE.BufferAttribute).array as Float32Array;
    g.dispose();
    return n;
  }, [mesh]);
  const saved = useMemo(() => segmentPoints(mesh, normals, seams.map((s) => s.path), lift), [mesh, normals, seams, lift]);
  const drawing = useMemo(() => segmentPoints(mesh, normals, [draft], lift * 1.5), [mesh, normals, draft, lift]);
  const suggested = useMemo(() => segmentPoints(mesh, normals, candidates, lift), [mesh, normals, candidates, lift]);
  const invalidate = useThree((s) => s.invalidate);
  useEffect(() => invalidate(), [saved, drawing, suggested, invalidate]);
  const draftDot = draft.length > 0 ? segmentPoints(mesh, normals, [[draft[draft.length - 1], draft[draft.length - 1]]], lift * 1.5)[0] : null;
  return (
    <>
      {saved.length > 0 ? <Line points={saved} segments color={SEAM_INK} lineWidth={2.5} /> : null}
      {suggested.length > 0 ? <Line points={suggested} segments color={CANDIDATE_INK} lineWidth={2} dashed dashSize={lift * 6} gapSize={lift * 4} /> : null}
      {drawing.length > 0 ? <Line points={drawing} segments color={DRAFT_INK} lineWidth={3.5} /> : null}
      {draftDot ? (
        <mesh position={draftDot}>
          <sphereGeometry args={[lift * 4, 12, 8]} />
          <meshBasicMaterial color={DRAFT_INK} />
        </mesh>
      ) : null}
    </>
  );
}

/**
 * Seam badges drawn as in the 2D view and on paper (components/pieces, geometry/export/piece-drawing.ts): the
 * number in a small teal-edged square, then the bevel with a triangle that is hollow for an outside corner and
 * solid for an inside one.
 */
function Badges({ badges }: { badges: readonly SeamBadge[] }) {
  const refs = useRef<(HTMLDivElement | null)[]>([]);
  const get = useThree((s) => s.get);
  // Badges on the far side of the model would show through it: hide those whose surface faces away from the camera.
  const show = (el: HTMLDivElement | null, b: SeamBadge) => {
    if (!el) return;
    const c = get().camera.position;
    const facing = (c.x - b.at[0]) * b.normal[0] + (c.y - b.at[1]) * b.normal[1] + (c.z - b.at[2]) * b.normal[2] > 0;
    el.style.visibility = facing ? 'visible' : 'hidden';
  };
  useFrame(() => badges.forEach((b, i) => show(refs.current[i], b)));
  return (
    <>
      {badges.map((b, i) => (
        <Html key={b.label} position={b.at} center zIndexRange={[20, 0]} style={{ pointerEvents: 'none' }}>
          <div
            ref={(el) => {
              refs.current[i] = el;
              show(el, b);
            }}
            aria-label={`Seam ${b.label}, bevel ${b.bevelDeg.toFixed(0)} degrees, ${b.convex ? 'outside' : 'inside'} corner`}
            style={{
              display: 'flex',
              alignItems: 'center',
              gap: 3,
              font: '600 11px DMMono-Medium, monospace',
              color: '#1b1b1b',
              background: 'rgba(255,252,246,0.92)',
              border: '1px solid #00756f',
              borderRadius: 2,
              padding: '1px 4px',
              whiteSpace: 'nowrap',
            }}
          >
            <span style={{ color: '#00756f' }}>{b.label}</span>
            <span style={{ color: '#b4501b' }}>
              {b.convex ? '▽' : '▼'}
              {b.bevelDeg.toFixed(0)}°
            </span>
          </div>
        </Html>
      ))}
    </>
  );
}

/** Direction the camera looks at the sculpt from: front (−y), a little to the right and above (z up). */
const VIEW_FROM = new THREE.Vector3(0.35, -1, 0.4).normalize();

/**
 * Puts the camera where the whole bounding sphere fits the canvas, for the narrower of the vertical and
 * horizontal fields of view (a phone's tall canvas needs more distance), once per mesh and canvas shape.
 */
function FitCamera({ center, radius }: { center: THREE.Vector3; radius: number }) {
  const camera = useThree((s) => s.camera);
  const width = useThree((s) => s.size.width);
  const height = useThree((s) => s.size.height);
  const invalidate = useThree((s) => s.invalidate);
  const tall = height > width;
  useEffect(() => {
    if (!(camera instanceof THREE.PerspectiveCamera) || width === 0 || height === 0) return;
    const vfov = THREE.MathUtils.degToRad(camera.fov);
    const hfov = 2 * Math.atan(Math.tan(vfov / 2) * (width / height));
    const distance = (1.08 * radius) / Math.sin(Math.min(vfov, hfov) / 2);
    camera.position.copy(center).addScaledVector(VIEW_FROM, distance);
    camera.lookAt(center);
    camera.updateProjectionMatrix();
    invalidate();
    // Refit only when the canvas turns between tall and wide, not on every resize, so the maker's view stays put.
  }, [camera, center, radius, tall, invalidate]);
  return null;
}

function FirstFrameMark() {
  const marked = useRef(false);
  useFrame(() => {
    if (marked.current) return;
    marked.current = true;
    if (typeof performance !== 'undefined' && typeof performance.mark === 'function') performance.mark('studio-first-mesh-frame');
  });
  return null;
}
