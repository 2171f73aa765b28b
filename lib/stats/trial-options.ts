import { z } from "zod";

/**
 * Options of one trial analysis, shared by the command line and the web app.
 *
 * Why a schema: the same rules (a block column for rcbd, row and column for
 * a Latin square, a margin with a reference) must hold whichever way the
 * analysis is started, and the messages must follow "<analysis> requires …".
 *
 * Reference: contract analysis-cli.md of this project.
 *
 * @example
 * trialOptionsSchema.parse({ design: "crd", response: "count", treatment: "spray" }).alpha // 0.05
 */
export const trialOptionsSchema = z
  .object({
    design: z.enum(["crd", "rcbd", "latin", "paired", "two-sample"], {
      error: "analysis requires --design crd, rcbd, latin, paired or two-sample",
    }),
    response: z.string({ error: "analysis requires a response column" }).min(1, "analysis requires a response column"),
    treatment: z.string({ error: "analysis requires a treatment column" }).min(1, "analysis requires a treatment column"),
    block: z.string().min(1).optional(),
    row: z.string().min(1).optional(),
    column: z.string().min(1).optional(),
    site: z.string().min(1).optional(),
    transform: z
      .enum(["none", "sqrt", "log1p", "asin-sqrt"], { error: "analysis requires --transform none, sqrt, log1p or asin-sqrt" })
      .default("none"),
    alpha: z
      .number({ error: "analysis requires alpha to be a number" })
      .gt(0, "analysis requires alpha between 0 and 0.5")
      .lt(0.5, "analysis requires alpha between 0 and 0.5")
      .default(0.05),
    control: z.string().min(1).optional(),
    reference: z.string().min(1).optional(),
    margin: z.number({ error: "equivalence test requires a numeric margin" }).positive("equivalence test requires a positive margin").optional(),
  })
  .superRefine((options, context) => {
    const need = (condition: boolean, message: string) => {
      if (!condition) context.addIssue({ code: "custom", message });
    };
    if (options.design === "rcbd") need(options.block !== undefined, "rcbd requires --block");
    if (options.design === "paired") need(options.block !== undefined, "paired t-test requires --block (the pairing column)");
    if (options.design === "latin") need(options.row !== undefined && options.column !== undefined, "latin square requires --row and --column");
    if (options.site !== undefined) need(options.design === "rcbd", "combined analysis over sites requires --design rcbd");
    need((options.reference === undefined) === (options.margin === undefined), "equivalence test requires both --reference and --margin");
  });

/** Validated options (defaults filled in). */
export type TrialOptions = z.output<typeof trialOptionsSchema>;
/** Options as a caller may give them. */
export type TrialOptionsInput = z.input<typeof trialOptionsSchema>;
