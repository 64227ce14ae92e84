import type { ReactNode } from 'react';
import { signalClasses, signalSymbol, type Signal } from './signal.ts';

/** A signal in colour AND in words with a symbol, never colour alone (design.md). */
export function SignalBadge({ signal, children }: { signal: Signal; children: ReactNode }) {
  return (
    <span
      data-signal={signal}
      className={`inline-flex items-center gap-1 whitespace-nowrap rounded border px-1.5 py-0.5 text-xs font-medium ${signalClasses[signal]}`}
    >
      <span aria-hidden="true">{signalSymbol[signal]}</span>
      {children}
    </span>
  );
}
