/**
 * `npm run --silent analyze -- file.csv --design rcbd --response y --treatment t --block b …`
 *
 * Reads a CSV (labels stay text), runs analyzeTrial and prints one JSON
 * document; on bad input prints a one-line reason on stderr and exits 1.
 * Interface fixed by the contract analysis-cli.md.
 */
import { readFileSync } from "node:fs";
import Papa from "papaparse";
import { analyzeTrial, StatsInputError } from "../lib/stats";

const valueOptions = new Set(["design", "response", "treatment", "block", "row", "column", "site", "transform", "alpha", "control", "reference", "margin"]);

function fail(message: string): never {
  process.stderr.write(`${message.replace(/\s+/g, " ").trim()}\n`);
  process.exit(1);
}

function parseArguments(argv: string[]): { file: string; options: Record<string, unknown> } {
  let file: string | undefined;
  const options: Record<string, unknown> = {};
  for (let index = 0; index < argv.length; index++) {
    const argument = argv[index];
    if (argument.startsWith("--")) {
      const [name, inline] = argument.slice(2).split(/=(.*)/s, 2);
      if (!valueOptions.has(name)) fail(`analysis does not know the option --${name}`);
      const value = inline !== undefined ? inline : argv[++index];
      if (value === undefined) fail(`analysis requires a value after --${name}`);
      if (name === "alpha" || name === "margin") {
        const number = Number(value);
        if (value.trim() === "" || !Number.isFinite(number)) fail(`analysis requires --${name} to be a number, got "${value}"`);
        options[name] = number;
      } else options[name] = value;
    } else if (file === undefined) file = argument;
    else fail(`analysis takes one CSV file, got a second one: ${argument}`);
  }
  if (file === undefined) fail("analysis requires a CSV file: npm run analyze -- file.csv --design crd --response y --treatment t");
  return { file, options };
}

function main(): void {
  const { file, options } = parseArguments(process.argv.slice(2));
  let text: string;
  try {
    text = readFileSync(file, "utf8");
  } catch (error) {
    fail(`analysis requires a readable CSV file: ${(error as Error).message}`);
  }
  const parsed = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ""), {
    header: true,
    dynamicTyping: false,
    skipEmptyLines: "greedy",
    transformHeader: (header) => header.trim(),
  });
  const fatal = parsed.errors.find((error) => error.type !== "FieldMismatch" || error.code === "TooManyFields");
  if (fatal) fail(`analysis requires a well-formed CSV: ${fatal.message}${fatal.row !== undefined ? ` at row ${fatal.row + 1}` : ""}`);
  try {
    const result = analyzeTrial(parsed.data, options as never);
    process.stdout.write(`${JSON.stringify(result, null, 2)}\n`);
  } catch (error) {
    if (error instanceof StatsInputError) fail(error.message);
    throw error;
  }
}

main();
