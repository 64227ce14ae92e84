import { zodResolver } from '@hookform/resolvers/zod';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { toast } from 'sonner';
import type { z } from 'zod';
import { EmptyState } from '@client/components/empty-state.tsx';
import { ErrorState } from '@client/components/error-state.tsx';
import { LoadingState } from '@client/components/loading-state.tsx';
import { formatDateTime } from '@client/components/number-format.ts';
import { errorMessage } from '@client/features/review/error-message.ts';
import { Section } from '@client/features/review/section.tsx';
import { createApiTokenSchema, type CreatedApiToken } from '@shared/api/tokens.ts';
import { createToken, revokeToken, tokenQueries } from './team-admin.queries.ts';

type TokenInput = z.input<typeof createApiTokenSchema>;
type TokenOutput = z.output<typeof createApiTokenSchema>;

/** The signed-in person's API tokens (for scripts and CI): create (shown once), list, revoke. */
export function TokensSection() {
  const queryClient = useQueryClient();
  const tokens = useQuery(tokenQueries.list());
  const [created, setCreated] = useState<CreatedApiToken | null>(null);
  const form = useForm<TokenInput, unknown, TokenOutput>({
    resolver: zodResolver(createApiTokenSchema),
    defaultValues: { name: '' },
  });
  const creating = useMutation({
    mutationFn: (v: TokenOutput) => createToken(v.name),
    onSuccess: async (token) => {
      setCreated(token);
      form.reset({ name: '' });
      toast.success(`Token “${token.name}” created; copy it now`);
      await queryClient.invalidateQueries({ queryKey: tokenQueries.all() });
    },
    onError: (error) => toast.error(`No token was created: ${errorMessage(error)}`),
  });
  const revoking = useMutation({
    mutationFn: revokeToken,
    onSuccess: async (token) => {
      toast.success(`Token “${token.name}” is revoked`);
      if (created?.id === token.id) setCreated(null);
      await queryClient.invalidateQueries({ queryKey: tokenQueries.all() });
    },
    onError: (error) => toast.error(`The token was not revoked: ${errorMessage(error)}`),
  });
  const copy = async (secret: string) => {
    try {
      await navigator.clipboard.writeText(secret);
      toast.success('Token copied');
    } catch {
      toast.error('The browser refused the clipboard; select the token and copy it by hand.');
    }
  };
  const nameError = form.formState.errors.name?.message;
  return (
    <Section title="Your API tokens" id="tokens">
      <p className="mb-3 text-sm text-ink-soft">
        Scripts and CI submit kernels with a token (
        <code className="font-mono">Authorization: Bearer …</code>). A token is shown once, when it
        is created.
      </p>
      <form
        noValidate
        onSubmit={form.handleSubmit((v) => creating.mutate(v))}
        className="flex flex-wrap items-end gap-3"
      >
        <label className="text-sm">
          <span className="block font-medium">Token name</span>
          <input
            aria-invalid={nameError ? true : undefined}
            placeholder="e.g. nightly CI"
            className="w-64 rounded border border-rule bg-white px-2 py-1"
            {...form.register('name')}
          />
        </label>
        <button
          type="submit"
          disabled={creating.isPending}
          className="rounded border border-ink bg-ink px-3 py-1.5 text-sm font-medium text-paper disabled:opacity-60"
        >
          Create token
        </button>
      </form>
      {nameError ? <p className="mt-1 text-sm text-beyond">✕ {nameError}</p> : null}
      {created ? (
        <div
          role="status"
          className="mt-4 rounded border border-near/60 bg-near/10 p-3 text-sm"
          data-testid="new-token"
        >
          <p className="font-medium">Copy “{created.name}” now; it will not be shown again.</p>
          <div className="mt-2 flex flex-wrap items-center gap-2">
            <label htmlFor="new-token-value" className="sr-only">
              The new token
            </label>
            <input
              id="new-token-value"
              readOnly
              value={created.token}
              onFocus={(e) => e.target.select()}
              className="w-[28rem] max-w-full rounded border border-rule bg-white px-2 py-1 font-mono text-xs"
            />
            <button
              type="button"
              onClick={() => void copy(created.token)}
              className="rounded border border-ink px-2 py-1"
            >
              Copy
            </button>
            <button type="button" onClick={() => setCreated(null)} className="underline">
              I have copied it
            </button>
          </div>
        </div>
      ) : null}
      <div className="mt-4">
        {tokens.isPending ? (
          <LoadingState label="Loading your tokens…" />
        ) : tokens.isError ? (
          <ErrorState error={tokens.error} onRetry={() => void tokens.refetch()} />
        ) : tokens.data.items.length === 0 ? (
          <EmptyState title="You have no API tokens." />
        ) : (
          <table className="w-full text-sm" data-testid="tokens-table">
            <thead className="border-b border-rule text-left text-ink-soft">
              <tr>
                <th className="py-1 pr-4 font-medium">Name</th>
                <th className="py-1 pr-4 font-medium">Begins with</th>
                <th className="py-1 pr-4 font-medium">Created</th>
                <th className="py-1 pr-4 font-medium">Last used</th>
                <th className="py-1 font-medium">State</th>
              </tr>
            </thead>
            <tbody>
              {tokens.data.items.map((t) => (
                <tr key={t.id} className="border-b border-rule/60">
                  <td className="py-1.5 pr-4">{t.name}</td>
                  <td className="py-1.5 pr-4 font-mono">{t.prefix}…</td>
                  <td className="py-1.5 pr-4 text-ink-soft">{formatDateTime(t.createdAt)}</td>
                  <td className="py-1.5 pr-4 text-ink-soft">
                    {t.lastUsedAt ? formatDateTime(t.lastUsedAt) : 'never'}
                  </td>
                  <td className="py-1.5">
                    {t.revokedAt ? (
                      <span className="text-ink-soft">revoked {formatDateTime(t.revokedAt)}</span>
                    ) : (
                      <button
                        type="button"
                        onClick={() => revoking.mutate(t.id)}
                        disabled={revoking.isPending}
                        className="text-beyond underline"
                        aria-label={`Revoke the token ${t.name}`}
                      >
                        Revoke
                      </button>
                    )}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </div>
    </Section>
  );
}
