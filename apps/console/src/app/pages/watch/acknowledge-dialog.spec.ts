import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { watchAlertFixture } from '../../testing/fixtures';
import { AcknowledgeDialog } from './acknowledge-dialog';

describe('AcknowledgeDialog', () => {
  it('acknowledges the alarm with the note, by submitting its form, and closes with the answer', () => {
    const close = jest.fn();
    TestBed.configureTestingModule({
      imports: [AcknowledgeDialog],
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: MAT_DIALOG_DATA, useValue: { watchId: 3, watchName: 'Checkout split', alert: watchAlertFixture({ id: 7 }) } },
        { provide: MatDialogRef, useValue: { close } },
      ],
    });
    const http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(AcknowledgeDialog);
    fixture.detectChanges();
    const root = fixture.nativeElement as HTMLElement;
    const note = root.querySelector('textarea')!;
    note.value = '  Weights changed on Tuesday; reverted.  ';
    note.dispatchEvent(new Event('input'));
    root.querySelector('form')!.dispatchEvent(new Event('submit'));
    const request = http.expectOne('/api/v1/alerts/7/acknowledge');
    expect(request.request.body).toEqual({ note: 'Weights changed on Tuesday; reverted.' });
    const acknowledged = watchAlertFixture({ id: 7, acknowledgedBy: { id: 3, name: 'Lee Lead' }, acknowledgedAt: '2026-12-02T12:00:00Z' });
    request.flush(acknowledged);
    expect(close).toHaveBeenCalledWith(acknowledged);
    http.verify();
  });
});
