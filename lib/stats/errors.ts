/**
 * The one error class of the statistics engine.
 *
 * Every message follows the pattern "<analysis> requires <condition>", in
 * lower case, so that the command line and the web app can show it as is.
 *
 * @example
 * new StatsInputError("anova requires at least two treatments").message
 * // "anova requires at least two treatments"
 */
export class StatsInputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "StatsInputError";
  }
}
