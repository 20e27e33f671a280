/** A note attached to a result: something the reader should know, that did not stop the analysis. */
export interface EngineWarning {
  /** stable machine-readable code, e.g. `shares-renormalised` */
  code: string;
  message: string;
}
