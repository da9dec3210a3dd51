/** A rule shipped as an example: the text in the rule language, where it comes from, and its defaults. */
export interface RuleExample {
  /** Stable id (experiment files and templates refer to it). */
  readonly id: string;
  readonly label: string;
  /** The learning rate the source recommends. */
  readonly defaultLearningRate: number;
  /** The paper or book the method comes from. */
  readonly source: string;
  /** The rule text, with comments. */
  readonly text: string;
}
