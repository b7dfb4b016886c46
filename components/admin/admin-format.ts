/** How the admin pages write times and money: short, unambiguous, the same on every list. */

/** Returns an ISO time as "2026-12-01 21:40" in the viewer's time zone, or "—" for none. */
export function adminTime(iso: string | null): string {
  if (!iso) return '—';
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  const p = (n: number) => String(n).padStart(2, '0');
  return `${d.getFullYear()}-${p(d.getMonth() + 1)}-${p(d.getDate())} ${p(d.getHours())}:${p(d.getMinutes())}`;
}

/** Returns an amount in minor units as "12.00 EUR" (two decimals, as the currencies the shop sells in use), or "free". */
export function adminMoney(cents: number, currency: string): string {
  return cents === 0 ? 'free' : `${(cents / 100).toFixed(2)} ${currency.toUpperCase()}`;
}
