/**
 * `npm run bench`: speed and memory figures of the analysis engines, printed in one run.
 * Not a test: nothing here fails a build; the README quotes the latest figures.
 */
const suites: Array<[string, () => Promise<{ run(): Promise<void> }>]> = [
  ["toolpath", () => import("./toolpath")],
  ["geometry", () => import("./geometry")],
  ["flowtests", () => import("./flowtests")],
];

const only = process.argv[2];
for (const [name, load] of suites) {
  if (only && only !== name) continue;
  console.log(`\n=== ${name} ===`);
  const suite = await load();
  await suite.run();
}
export {};
