import { describe, expect, it } from 'vitest';
import { attemptOutcomeText, deliveriesPollIntervalMs, deliveryStatus, endpointStatus, responseCodeText } from './delivery-display';

// Standard Webhooks v1.0.0 (standardwebhooks.com spec): any 2xx is success; 410 Gone tells the sender to stop.
describe('delivery display', () => {
  it('names a delivery by what happened to it', () => {
    expect(deliveryStatus({ status: 'succeeded', attempts: 1 }).label).toBe('Delivered');
    expect(deliveryStatus({ status: 'pending', attempts: 0 }).label).toBe('Pending');
    expect(deliveryStatus({ status: 'pending', attempts: 2 }).label).toBe('Retrying');
    expect(deliveryStatus({ status: 'failed', attempts: 9 }).tone).toBe('danger');
  });

  it('tells a paused endpoint from one the service disabled after 410 Gone', () => {
    expect(endpointStatus({ enabled: true, disabledReason: null }).label).toBe('Enabled');
    expect(endpointStatus({ enabled: false, disabledReason: null }).label).toBe('Paused');
    expect(endpointStatus({ enabled: false, disabledReason: 'gone' }).label).toBe('Disabled after 410');
  });

  it('turns stored attempt outcomes into words, keeping unknown reasons readable', () => {
    expect(attemptOutcomeText('succeeded')).toBe('Delivered');
    expect(attemptOutcomeText('disable_endpoint')).toMatch(/410 Gone/);
    expect(attemptOutcomeText('retry:server_error')).toBe('Failed, will retry (server error)');
    expect(attemptOutcomeText('retry:some_new_reason')).toBe('Failed, will retry (some new reason)');
  });

  it('shows the response code, or why there is none', () => {
    expect(responseCodeText({ attempts: 1, lastResponseStatus: 204 })).toBe('204');
    expect(responseCodeText({ attempts: 0, lastResponseStatus: null })).toBe('Not sent yet');
    expect(responseCodeText({ attempts: 3, lastResponseStatus: null })).toBe('No answer');
  });

  it('polls faster while a delivery is on its way', () => {
    expect(deliveriesPollIntervalMs(['succeeded', 'pending'])).toBeLessThan(deliveriesPollIntervalMs(['succeeded']));
    expect(deliveriesPollIntervalMs([])).toBe(deliveriesPollIntervalMs(['failed']));
  });
});
