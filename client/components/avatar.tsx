/**
 * A person's monogram. Drawn here rather than fetched from the provider, so no page loads
 * anything from another site.
 */
export function Avatar({ login, name }: { login: string; name?: string | null }) {
  const source = (name ?? login).trim();
  const parts = source.split(/[\s._-]+/).filter(Boolean);
  const initials = (parts.length > 1 ? `${parts[0]![0]}${parts[1]![0]}` : source.slice(0, 2))
    .toUpperCase()
    .normalize('NFD')
    .replace(/[\u0300-\u036f]/g, '');
  let hue = 0;
  for (const ch of login) hue = (hue * 31 + ch.charCodeAt(0)) % 360;
  return (
    <span
      aria-hidden="true"
      className="inline-flex h-7 w-7 shrink-0 items-center justify-center rounded-full border border-ink/20 font-mono text-xs font-medium text-ink"
      style={{ backgroundColor: `hsl(${hue} 35% 86%)` }}
    >
      {initials}
    </span>
  );
}
