import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ProductionRole } from '@domain/policy/index.ts';
import { api } from '../../../lib/api.ts';

export interface AdminMembership {
  productionId: string;
  productionName: string;
  role: ProductionRole;
  venueIds: string[];
}

export interface AdminUser {
  id: string;
  email: string;
  name: string;
  isAdmin: boolean;
  /** False until the invitation is accepted, or after the account is switched off. */
  active: boolean;
  memberships: AdminMembership[];
}

/** `GET /api/admin/users` → every person in the company, with their memberships. */
export async function getUsers(): Promise<AdminUser[]> {
  const res = await api.get<{ users: AdminUser[] }>('/admin/users');
  return res?.users ?? [];
}

export function usersQueryOptions() {
  return queryOptions({ queryKey: ['admin', 'users'] as const, queryFn: getUsers });
}

export function useUsers() {
  return useQuery(usersQueryOptions());
}
