/** MariaDB's duplicate-key error. mysql2 sometimes names MariaDB errors wrongly, so match the number. */
const ER_DUP_ENTRY = 1062;

export function isDuplicateKeyError(error: unknown): boolean {
  const errno = (error as { errno?: unknown; cause?: { errno?: unknown } } | null)?.errno ??
    (error as { cause?: { errno?: unknown } } | null)?.cause?.errno;
  return errno === ER_DUP_ENTRY;
}
