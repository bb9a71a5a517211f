import { Router } from 'express';
import { pageOf } from '../objects/list';
import type { ProviderState } from '../state';
import { listOptions, onlyParams, optionalArray, optionalBoolean, optionalString } from './params';
import { missingObject } from './provider-request-error';
import { idParam, paramsOf } from './route-helpers';

export function catalogueRoutes(state: ProviderState): Router {
  const router = Router();

  router.get('/v1/prices', (request, response) => {
    const params = paramsOf(request);
    onlyParams(params, ['active', 'lookup_keys', 'product', 'type', 'currency', 'limit', 'starting_after']);
    const active = optionalBoolean(params, 'active');
    const lookupKeys = optionalArray(params, 'lookup_keys')?.map(String);
    const product = optionalString(params, 'product');
    const type = optionalString(params, 'type');
    const currency = optionalString(params, 'currency');
    const prices = [...state.prices.values()].filter(
      (price) =>
        (active === undefined || price.active === active) &&
        (lookupKeys === undefined || (price.lookup_key !== null && lookupKeys.includes(price.lookup_key))) &&
        (product === undefined || price.product === product) &&
        (type === undefined || price.type === type) &&
        (currency === undefined || price.currency === currency),
    );
    response.json(pageOf(prices, '/v1/prices', listOptions(params)));
  });

  router.get('/v1/prices/:id', (request, response) => {
    const price = state.prices.get(idParam(request));
    if (!price) throw missingObject('price', idParam(request));
    response.json(price);
  });

  router.get('/v1/products', (request, response) => {
    const params = paramsOf(request);
    onlyParams(params, ['active', 'limit', 'starting_after']);
    const active = optionalBoolean(params, 'active');
    const products = [...state.products.values()].filter((product) => active === undefined || product.active === active);
    response.json(pageOf(products, '/v1/products', listOptions(params)));
  });

  router.get('/v1/products/:id', (request, response) => {
    const product = state.products.get(idParam(request));
    if (!product) throw missingObject('product', idParam(request));
    response.json(product);
  });

  return router;
}
