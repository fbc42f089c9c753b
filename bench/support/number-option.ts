/** `--name N` on the command line as a number, or `fallback` when the flag is absent (benches' numeric options). */
export function numberOption(name: string, fallback: number, argv: readonly string[] = process.argv): number {
  const at = argv.indexOf(name)
  return at >= 0 ? Number(argv[at + 1]) : fallback
}
