// Imports each module named on the command line as if it were the first one loaded (see hooks.mjs), in
// one process, and prints one JSON line per failure. Run it after tsx: node --import tsx import-each.mjs …
import { register } from "node:module";
import { pathToFileURL } from "node:url";

register("./hooks.mjs", import.meta.url);
const files = process.argv.slice(2);
for (const [index, file] of files.entries()) {
  try {
    await import(`${pathToFileURL(file).href}?fresh=${index + 1}`);
  } catch (error) {
    console.log(JSON.stringify({ file, error: `${error?.constructor?.name}: ${error?.message}` }));
  }
}
console.log(JSON.stringify({ imported: files.length }));
