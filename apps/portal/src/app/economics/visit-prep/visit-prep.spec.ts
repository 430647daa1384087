import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { RequestStatus, VisitPrep as VisitPrepData } from '@cc/shared';
import { VisitPrep } from './visit-prep';

describe('VisitPrep (photos for the electrician)', () => {
  async function render(prep: VisitPrepData, status: RequestStatus | null): Promise<HTMLElement> {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    const http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(VisitPrep);
    fixture.componentRef.setInput('requestId', 31);
    fixture.componentRef.setInput('status', status);
    // The first change detection starts the resource's request (whenStable would wait for its answer).
    fixture.detectChanges();
    http.expectOne('/api/requests/31/visit-prep').flush(prep);
    await fixture.whenStable();
    return fixture.nativeElement;
  }

  it('offers the upload form to those who may add photos', async () => {
    const el = await render({ photos: [], evidence: [], canAddPhotos: true }, 'approved');
    expect(el.querySelector('form[aria-label="Add intake photos"]')).not.toBeNull();
    expect(el.textContent).toContain('No photos yet.');
  });

  it('tells the others who adds photos while the work is still to come', async () => {
    const el = await render({ photos: [], evidence: [], canAddPhotos: false }, 'scheduled');
    expect(el.querySelector('form')).toBeNull();
    expect(el.textContent).toContain('The agents and the seller can add photos');
  });

  it('says no photos were added once the work is done, instead of inviting any', async () => {
    const el = await render({ photos: [], evidence: [], canAddPhotos: false }, 'corrected');
    expect(el.querySelector('form')).toBeNull();
    expect(el.textContent).toContain('No photos were added before the work.');
    expect(el.textContent).not.toContain('can add photos');
  });
});
