import { newObjectId, unixSeconds } from '../ids';

export interface FakeCustomer {
  id: string;
  object: 'customer';
  address: null;
  balance: number;
  created: number;
  currency: string | null;
  default_source: null;
  delinquent: boolean;
  description: string | null;
  email: string | null;
  invoice_prefix: string;
  invoice_settings: { custom_fields: null; default_payment_method: null; footer: null; rendering_options: null };
  livemode: false;
  metadata: Record<string, string>;
  name: string | null;
  next_invoice_sequence: number;
  phone: string | null;
  preferred_locales: string[];
  shipping: null;
  tax_exempt: 'none';
  test_clock: null;
}

export interface CustomerFields {
  name?: string | null;
  email?: string | null;
  description?: string | null;
  phone?: string | null;
  metadata?: Record<string, string>;
}

export function buildCustomer(fields: CustomerFields): FakeCustomer {
  const id = newObjectId('cus');
  return {
    id,
    object: 'customer',
    address: null,
    balance: 0,
    created: unixSeconds(),
    currency: null,
    default_source: null,
    delinquent: false,
    description: fields.description ?? null,
    email: fields.email ?? null,
    invoice_prefix: id.slice(4, 12).toUpperCase(),
    invoice_settings: { custom_fields: null, default_payment_method: null, footer: null, rendering_options: null },
    livemode: false,
    metadata: fields.metadata ?? {},
    name: fields.name ?? null,
    next_invoice_sequence: 1,
    phone: fields.phone ?? null,
    preferred_locales: [],
    shipping: null,
    tax_exempt: 'none',
    test_clock: null,
  };
}
