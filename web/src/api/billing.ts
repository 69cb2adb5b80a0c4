import type { Plan } from '@basinwright/common';
import { request } from './client';

export type PaidPlan = Exclude<Plan, 'concept'>;

export interface BillingInvoice {
  id: string;
  number: string | null;
  status: string | null;
  amountDue: number;
  amountPaid: number;
  currency: string;
  created: string;
  periodStart: string | null;
  periodEnd: string | null;
}

export interface BillingSummary {
  plan: Plan;
  planName: string;
  seats: { paid: number; used: number };
  billingStatus: 'active' | 'past_due' | 'read_only';
  graceEndsAt: string | null;
  subscription: { cancelAtPeriodEnd: boolean; currentPeriodEnd: string | null } | null;
  nextInvoice: { amountDue: number; currency: string; date: string | null } | null;
  invoices: BillingInvoice[];
  offers: { plan: PaidPlan; unitAmount: number | null; currency: string; minimumSeats: number }[];
  paymentServiceReachable: boolean;
  canManage: boolean;
}

export const billingApi = {
  summary: (signal?: AbortSignal) => request<BillingSummary>('/billing', { signal }),
  checkout: (body: { plan: PaidPlan; seats: number }) =>
    request<{ url: string }>('/billing/checkout', { method: 'POST', body }),
  changeSeats: (seats: number) =>
    request<{ requested: number }>('/billing/seats', { method: 'PATCH', body: { seats } }),
  changePlan: (body: { plan: PaidPlan; seats?: number }) =>
    request<{ requested: { plan: PaidPlan; seats: number } }>('/billing/plan', {
      method: 'PATCH',
      body,
    }),
  cancel: () => request<{ cancelAtPeriodEnd: boolean }>('/billing/cancel', { method: 'POST' }),
  resume: () => request<{ cancelAtPeriodEnd: boolean }>('/billing/resume', { method: 'POST' }),
  portal: () => request<{ url: string }>('/billing/portal', { method: 'POST' }),
};
