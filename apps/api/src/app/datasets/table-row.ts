/**
 * Receives the rows of an uploaded table one at a time, synchronously, while the file streams.
 * `where` names the row's place ("line 7", "row 7") for error messages; call it during the visit.
 * A visitor that throws stops the read, and the read rejects with that error.
 */
export type RowVisitor = (cells: string[], where: () => string) => void;
