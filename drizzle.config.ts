import { defineConfig } from 'drizzle-kit';

export default defineConfig({
  dialect: 'postgresql',
  schema: './server/db/schema',
  out: './server/db/migrations',
  dbCredentials: {
    url: process.env.DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54329/stablehand',
  },
  // pg-boss keeps its own schema; drizzle-kit must not touch it.
  schemaFilter: ['public'],
});
