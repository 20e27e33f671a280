/** The kinds of file a dataset can be uploaded from. */
export const ACCEPTED_EXTENSIONS = ['.csv', '.tsv', '.txt', '.xlsx'] as const;

/** Larger files are refused before any byte is sent (the API has its own limit as well). */
export const MAX_UPLOAD_BYTES = 20 * 1024 * 1024;

/** Why a chosen file cannot be uploaded, or null when it can. */
export function uploadFileProblem(file: Pick<File, 'name' | 'size'>): string | null {
  const name = file.name.toLowerCase();
  if (!ACCEPTED_EXTENSIONS.some((extension) => name.endsWith(extension))) {
    return `“${file.name}” is not a CSV, TSV, text or Excel (.xlsx) file.`;
  }
  if (file.size === 0) return `“${file.name}” is empty.`;
  if (file.size > MAX_UPLOAD_BYTES) {
    return `“${file.name}” is ${(file.size / 1024 / 1024).toFixed(1)} MB; files up to ${MAX_UPLOAD_BYTES / 1024 / 1024} MB can be uploaded.`;
  }
  return null;
}
