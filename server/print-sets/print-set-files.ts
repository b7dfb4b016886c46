/** Where a print set's files live in the file store: `print-sets/<print set id>/<file name>`. */

/** Returns the store prefix holding every file of print set `id`. */
export function printSetFilePrefix(id: string): string {
  return `print-sets/${id}`;
}

/** Returns the store key of file `name` of print set `id`. */
export function printSetFileKey(id: string, name: string): string {
  return `${printSetFilePrefix(id)}/${name}`;
}
