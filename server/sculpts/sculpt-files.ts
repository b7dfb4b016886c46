/** Where a sculpt's files live in the FileStore. */

/** Prefix of every file of sculpt `sculptId` (the id is a database UUID, never a name a person chose). */
export const sculptFilePrefix = (sculptId: string): string => `sculpts/${sculptId}`;
/** Key of the uploaded model file, by its detected format ("obj", "stl" or "ply"). */
export const sculptSourceKey = (sculptId: string, format: string): string => `${sculptFilePrefix(sculptId)}/source.${format}`;
/** Key of the working mesh (geometry/io/working-mesh.ts format). */
export const sculptMeshKey = (sculptId: string): string => `${sculptFilePrefix(sculptId)}/mesh.bin`;
