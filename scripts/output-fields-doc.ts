/**
 * The README's table of analysis outputs, made from the engine's table (src/engine/output-fields.ts) and
 * its methods entries, so the API docs and the methods page cannot drift. Prints it, or with --write puts
 * it into README.md between the two marker lines. tests/engine/methods.test.ts checks README.md holds
 * exactly this. Run: npx tsx scripts/output-fields-doc.ts [--write]
 */
import { readFileSync, writeFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { outputFieldsMarkdown } from "../src/engine/output-fields";

const README_METHODS_URL = "http://127.0.0.1:3000/methods";
const BEGIN = "<!-- output fields: made by scripts/output-fields-doc.ts -->";
const END = "<!-- end of output fields -->";

const table = outputFieldsMarkdown(README_METHODS_URL);
if (process.argv.includes("--write")) {
  const path = fileURLToPath(new URL("../README.md", import.meta.url));
  const readme = readFileSync(path, "utf8");
  const a = readme.indexOf(BEGIN);
  const b = readme.indexOf(END);
  if (a < 0 || b < a) throw new Error(`README.md needs the lines ${BEGIN} and ${END}`);
  writeFileSync(path, `${readme.slice(0, a + BEGIN.length)}\n${table}\n${readme.slice(b)}`);
  console.log("README.md: output fields table written");
} else {
  console.log(table);
}
