/**
 * A file we cannot read as a table of categories. `where` names the place ("line 7", "row 3"),
 * `problem` says what is wrong there, in plain words the uploader can act on.
 */
export class DatasetFormatError extends Error {
  constructor(
    readonly where: string,
    readonly problem: string,
  ) {
    super(`${where}: ${problem}`);
  }
}
