/** First value of a route parameter (expo-router hands arrays for repeated keys). */
export function firstParam(value: string | string[] | undefined): string {
  return (Array.isArray(value) ? value[0] : value)?.trim() ?? '';
}
