import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { RequestsApi } from './requests-api';

describe('RequestsApi', () => {
  let api: RequestsApi;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    api = TestBed.inject(RequestsApi);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  it('sends several statuses comma-separated and leaves out an empty search', () => {
    api.list({ page: 2, pageSize: 10, sort: 'street', direction: 'desc', status: 'quoted,approved', q: '' }).subscribe();
    const req = http.expectOne((r) => r.url === '/api/requests');
    expect(req.request.params.get('status')).toBe('quoted,approved');
    expect(req.request.params.get('page')).toBe('2');
    expect(req.request.params.get('sort')).toBe('street');
    expect(req.request.params.has('q')).toBe(false);
    req.flush({ items: [], total: 0, page: 2, pageSize: 10 });
  });

  it('puts the contractor on a request', () => {
    api.assignContractor(7, { contractorOrganisationId: 3 }).subscribe();
    const req = http.expectOne('/api/requests/7/contractor');
    expect(req.request.method).toBe('PUT');
    expect(req.request.body).toEqual({ contractorOrganisationId: 3 });
    req.flush({});
  });
});
