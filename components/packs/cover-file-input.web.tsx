/** A file picker for a pack's cover (web): PNG or JPEG, checked again by content on the server. */

/** Renders a labelled file input; calls `onPick` with the chosen file (or null when cleared). */
export function CoverFileInput({ onPick }: { onPick: (file: Blob | null) => void }) {
  return (
    <label style={{ display: 'block', fontFamily: 'Archivo-SemiBold', fontSize: 14, margin: '12px 0' }}>
      Cover image (PNG or JPEG, up to 5 MB)
      <input
        type="file"
        accept="image/png,image/jpeg"
        aria-label="Cover image"
        style={{ display: 'block', marginTop: 6 }}
        onChange={(e) => onPick(e.currentTarget.files?.[0] ?? null)}
      />
    </label>
  );
}
