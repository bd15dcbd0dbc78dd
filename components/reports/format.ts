/** "1,234 kg" or "12.3 kg": whole kilograms once there are enough of them. */
export function formatKg(kg: number): string {
  return `${kg >= 100 ? Math.round(kg).toLocaleString("en-GB") : Number(kg.toFixed(1)).toLocaleString("en-GB")} kg`;
}
