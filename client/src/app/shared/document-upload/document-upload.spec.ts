import { HttpEventType, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';

import type { DocumentView } from '@contracts/sources/sources-schemas';
import { errorInterceptor } from '../../core/error-interceptor';
import { DocumentUpload, MAX_PDF_BYTES } from './document-upload';

@Component({
  imports: [DocumentUpload],
  template: `<thalpos-document-upload sourceId="12" (uploaded)="uploaded.push($event)" />`,
})
class Host {
  readonly uploaded: DocumentView[] = [];
}

jest.setTimeout(30_000);

const stored: DocumentView = {
  id: '4',
  sourceId: '12',
  fileName: 'log.pdf',
  size: 9,
  sha256: 'a'.repeat(64),
  uploadedAt: '2026-12-02T12:00:00.000Z',
  uploadedBy: { login: 'demo-curator', name: 'Priya Nandakumar' },
};

async function until(check: () => boolean, fixture: { whenStable(): Promise<unknown> }) {
  while (!check()) {
    await fixture.whenStable();
    await new Promise((resolve) => setTimeout(resolve, 10));
  }
}

describe('DocumentUpload', () => {
  let backend: HttpTestingController;

  function setUp() {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(Host);
    fixture.detectChanges();
    const upload = fixture.debugElement.children[0]!.componentInstance as DocumentUpload;
    const text = () => (fixture.nativeElement as HTMLElement).textContent ?? '';
    return { fixture, upload, text };
  }

  afterEach(() => backend.verify());

  it('sends the file as multipart, shows progress, and reports the stored document', async () => {
    const { fixture, upload, text } = setUp();
    upload.send(new File(['%PDF-1.4\n'], 'log.pdf', { type: 'application/pdf' }));
    const request = backend.expectOne({ method: 'POST', url: '/api/v1/sources/12/documents' });
    expect(request.request.body).toBeInstanceOf(FormData);
    expect((request.request.body as FormData).get('file')).toBeInstanceOf(File);
    request.event({ type: HttpEventType.UploadProgress, loaded: 3, total: 4 });
    await until(() => text().includes('75%'), fixture);
    expect(fixture.nativeElement.querySelector('mat-progress-bar')).not.toBeNull();
    request.flush(stored, { status: 201, statusText: 'Created' });
    await until(() => text().includes('log.pdf attached.'), fixture);
    expect(fixture.componentInstance.uploaded).toEqual([stored]);
    expect(fixture.nativeElement.querySelector('mat-progress-bar')).toBeNull();
  });

  it('refuses a file over 20 MB before sending anything', async () => {
    const { fixture, upload, text } = setUp();
    const big = new File(['x'], 'scan.pdf', { type: 'application/pdf' });
    Object.defineProperty(big, 'size', { value: MAX_PDF_BYTES + 1 });
    upload.send(big);
    backend.expectNone('/api/v1/sources/12/documents');
    await until(() => text().includes('larger than 20 MB'), fixture);
  });

  it('shows the server’s refusal of a file that is not a PDF', async () => {
    const { fixture, upload, text } = setUp();
    upload.send(new File(['PNG'], 'photo.pdf', { type: 'application/pdf' }));
    backend.expectOne('/api/v1/sources/12/documents').flush(
      {
        error: {
          code: 'not_pdf',
          message: 'Only PDF documents can be attached; this file is not a PDF',
        },
      },
      { status: 415, statusText: 'Unsupported Media Type' },
    );
    await until(() => text().includes('this file is not a PDF'), fixture);
    expect(fixture.componentInstance.uploaded).toEqual([]);
  });
});
