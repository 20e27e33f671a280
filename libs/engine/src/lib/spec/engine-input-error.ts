/** One problem with an input: the dotted path of the field (e.g. `observed.counts.2`) and the rule it breaks. */
export interface InputIssue {
  path: string;
  message: string;
}

/**
 * Thrown for every invalid input to the engine. `issues` names each offending field and the rule,
 * so callers (the CLI, the API) can show them without parsing the message.
 */
export class EngineInputError extends Error {
  override readonly name = 'EngineInputError';
  readonly issues: InputIssue[];

  constructor(issues: InputIssue[]) {
    super(
      issues.length === 0
        ? 'invalid input'
        : issues.map((issue) => (issue.path ? `${issue.path}: ${issue.message}` : issue.message)).join('; '),
    );
    this.issues = issues;
  }

  /** Convenience for a single problem. */
  static at(path: string, message: string): EngineInputError {
    return new EngineInputError([{ path, message }]);
  }
}
