import type { Filter } from '@mikro-orm/core';

type FilterDef = Parameters<typeof Filter>[0];

/**
 * The tenant filter, on by default on every studio-owned entity: a query without the studio's id
 * fails loudly instead of reading across studios. Studio context sets the id per request;
 * the few cross-studio reads (sign-in, platform pages) switch it off by name, visibly.
 */
export const TENANT_FILTER = 'tenant';

export const tenantFilter: FilterDef = {
  name: TENANT_FILTER,
  cond: (args: { studioId?: string }) => ({ studio: args.studioId }),
  default: true,
};

export const withoutTenantFilter = { filters: { [TENANT_FILTER]: false } } as const;
