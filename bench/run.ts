// `npm run bench -- <name>` runs bench/<name>.ts's exported run().
export {};

const benchName = process.argv[2];
if (!benchName || !/^[a-z0-9-]+$/.test(benchName)) {
  console.error('Usage: npm run bench -- <name>   (e.g. engine)');
  process.exit(1);
}
const mod = (await import(`./${benchName}.ts`)) as { run: () => Promise<void> };
await mod.run();
