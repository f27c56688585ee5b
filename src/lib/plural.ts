/** "1 connector", "2 connectors", "1 cavity", "3 cavities": a count with its noun agreeing. */
export function plural(count: number, one: string, many = `${one}s`): string {
  return `${count} ${count === 1 ? one : many}`;
}
