import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { OutboxPage } from './outbox-page';

describe('OutboxPage', () => {
  let http: HttpTestingController;

  function render() {
    TestBed.configureTestingModule({ imports: [OutboxPage], providers: [provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(OutboxPage);
    fixture.detectChanges();
    TestBed.tick();
    return fixture;
  }

  afterEach(() => http.verify());

  it('lists what the mail stand-in received and checks again on request', () => {
    const fixture = render();
    http.expectOne('/api/v1/outbox').flush({
      available: true,
      destination: 'built-in stand-in on 127.0.0.1:2525',
      messages: [
        {
          id: 1,
          receivedAt: '2026-11-24T10:00:00.000Z',
          from: 'tallyfit@localhost',
          to: ['pat@example.org'],
          subject: 'Ana Analyst shared “Help-desk tickets by weekday”',
          text: 'The report is attached.',
          attachments: [{ fileName: 'report.md', contentType: 'text/markdown', sizeBytes: 2048 }],
        },
      ],
    });
    fixture.detectChanges();
    const root = fixture.nativeElement as HTMLElement;
    expect(root.textContent).toContain('Help-desk tickets by weekday');
    expect(root.textContent).toContain('to pat@example.org');
    expect(root.textContent).toContain('report.md (text/markdown, 2,048 bytes)');
    Array.from(root.querySelectorAll('button')).find((b) => b.textContent?.includes('Check again'))!.click();
    TestBed.tick();
    http.expectOne('/api/v1/outbox').flush({ available: true, destination: 'x', messages: [] });
    fixture.detectChanges();
    expect(root.textContent).toContain('No mail yet.');
  });

  it('explains that nothing is kept when mail goes to a real server', () => {
    const fixture = render();
    http.expectOne('/api/v1/outbox').flush({ available: false, destination: 'smtp.example.org:587', messages: [] });
    fixture.detectChanges();
    expect(fixture.nativeElement.textContent).toContain('Mail goes to smtp.example.org:587');
  });
});
