import { Router } from 'express';
import { buildCustomer, type CustomerFields } from '../objects/customer';
import type { ProviderState } from '../state';
import { onlyParams, optionalMetadata, optionalString, type Params } from './params';
import { missingObject } from './provider-request-error';
import { idParam, paramsOf } from './route-helpers';

const CUSTOMER_FIELDS = ['name', 'email', 'description', 'phone', 'metadata'];

function customerFields(params: Params): CustomerFields {
  onlyParams(params, CUSTOMER_FIELDS);
  return {
    name: optionalString(params, 'name'),
    email: optionalString(params, 'email'),
    description: optionalString(params, 'description'),
    phone: optionalString(params, 'phone'),
    metadata: optionalMetadata(params, 'metadata'),
  };
}

export function customersRoutes(state: ProviderState): Router {
  const router = Router();

  router.post('/v1/customers', (request, response) => {
    const customer = buildCustomer(customerFields(paramsOf(request)));
    state.customers.set(customer.id, customer);
    response.json(customer);
  });

  router.get('/v1/customers/:id', (request, response) => {
    const customer = state.customers.get(idParam(request));
    if (!customer) throw missingObject('customer', idParam(request));
    response.json(customer);
  });

  router.post('/v1/customers/:id', (request, response) => {
    const customer = state.customers.get(idParam(request));
    if (!customer) throw missingObject('customer', idParam(request));
    const fields = customerFields(paramsOf(request));
    if (fields.name !== undefined) customer.name = fields.name;
    if (fields.email !== undefined) customer.email = fields.email;
    if (fields.description !== undefined) customer.description = fields.description;
    if (fields.phone !== undefined) customer.phone = fields.phone;
    if (fields.metadata !== undefined) customer.metadata = { ...customer.metadata, ...fields.metadata };
    response.json(customer);
  });

  return router;
}
