/** The IANA time zones this browser knows (empty when it cannot list them). */
export function supportedTimeZones(): string[] {
  try {
    return (Intl as { supportedValuesOf?: (key: string) => string[] }).supportedValuesOf?.('timeZone') ?? [];
  } catch {
    return [];
  }
}

/** The zones to choose from, with UTC and the current value always among them. */
export function timeZoneChoices(current: string, supported: string[] = supportedTimeZones()): string[] {
  const zones = supported.includes('UTC') ? supported : ['UTC', ...supported];
  return current === '' || zones.includes(current) ? zones : [current, ...zones];
}
