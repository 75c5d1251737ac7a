/** Largest file the import takes (bytes): the API's limit (`POST /models/import`, 1 MiB). */
export const MAX_IMPORT_BYTES = 1024 * 1024;

/** File types the import reads: a bundle as exported, or a CSV. */
export const IMPORT_ACCEPT = '.json,.csv';

/** A size for people: "512 B", "37.4 KiB", "1.0 MiB". */
export function fileSize(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  if (bytes < 1024 * 1024) return `${(bytes / 1024).toFixed(1)} KiB`;
  return `${(bytes / (1024 * 1024)).toFixed(1)} MiB`;
}

/** Why a file cannot be imported (type or size), checked before uploading; null when it can be sent. */
export function importFileProblem(file: Pick<File, 'name' | 'size'>): string | null {
  const name = file.name.toLowerCase();
  if (!name.endsWith('.json') && !name.endsWith('.csv')) return `${file.name} is not a .json bundle or a .csv file.`;
  if (file.size === 0) return `${file.name} is empty.`;
  if (file.size > MAX_IMPORT_BYTES) return `${file.name} is ${fileSize(file.size)}; the import takes files up to ${fileSize(MAX_IMPORT_BYTES)}. Split it into smaller files.`;
  return null;
}
