import { TestBed } from '@angular/core/testing';
import { HttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { MatIconRegistry } from '@angular/material/icon';
import { firstValueFrom } from 'rxjs';
import { appConfig } from './app.config';

describe('appConfig', () => {
  afterEach(() => {
    document.cookie = 'XSRF-TOKEN=; expires=Thu, 01 Jan 1970 00:00:00 GMT; path=/';
  });

  // DESIGN.md, "People": CSRF with Angular's defaults, cookie XSRF-TOKEN and header X-XSRF-TOKEN
  // (angular.dev, "HttpClient: security / XSRF protection").
  it('copies the XSRF-TOKEN cookie into the X-XSRF-TOKEN header of a state-changing request', async () => {
    TestBed.configureTestingModule({ providers: [...appConfig.providers, provideHttpClientTesting()] });
    document.cookie = 'XSRF-TOKEN=token-from-server; path=/';
    const http = TestBed.inject(HttpClient);
    const backend = TestBed.inject(HttpTestingController);

    const done = firstValueFrom(http.post('/api/specs', { text: 'schema: 1' }));
    const request = backend.expectOne('/api/specs');
    request.flush({});
    await done;

    expect(request.request.headers.get('X-XSRF-TOKEN')).toBe('token-from-server');
  });

  it('draws ligature icons with the Material Symbols Outlined font class', () => {
    TestBed.configureTestingModule({ providers: appConfig.providers });

    expect(TestBed.inject(MatIconRegistry).getDefaultFontSetClass()).toEqual(['material-symbols-outlined']);
  });
});
