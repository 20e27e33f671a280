import { DeferBlockBehavior, TestBed, type ComponentFixture } from '@angular/core/testing';
import { stubIntersectionObserver } from '../../testing/intersection-observer-stub';
import { PlannerPage } from './planner-page';

describe('PlannerPage', () => {
  beforeAll(stubIntersectionObserver);

  let fixture: ComponentFixture<PlannerPage>;
  let root: HTMLElement;

  beforeEach(async () => {
    TestBed.configureTestingModule({ imports: [PlannerPage], deferBlockBehavior: DeferBlockBehavior.Manual });
    fixture = TestBed.createComponent(PlannerPage);
    root = fixture.nativeElement as HTMLElement;
    await settle();
  });

  async function settle(): Promise<void> {
    fixture.detectChanges();
    await fixture.whenStable();
    fixture.detectChanges();
  }

  async function type(name: string, value: string): Promise<void> {
    const input = root.querySelector<HTMLInputElement>(`input[name="${name}"]`)!;
    input.value = value;
    input.dispatchEvent(new Event('input'));
    await settle();
  }

  const toggle = async (label: string) => {
    Array.from(root.querySelectorAll<HTMLButtonElement>('mat-button-toggle button'))
      .find((button) => button.textContent?.trim() === label)!
      .click();
    await settle();
  };

  it('finds the observations needed for a medium effect', async () => {
    // Cohen (1988), Table 7.4.6 (from memory): w = 0.3, df = 3, alpha = .05, power .80 needs n ≈ 121.
    const n = Number(root.querySelector('[data-testid="planned-n"]')?.textContent?.replace(/,/g, ''));
    expect(n).toBeGreaterThanOrEqual(119);
    expect(n).toBeLessThanOrEqual(123);
  });

  it('finds the power of a given sample', async () => {
    await toggle('Power for my sample');
    await type('n', '1000');
    await type('w', '0.1');
    await type('df', '1');
    // Cohen (1988), Table 7.3.15 (from memory): w = 0.1, df = 1, alpha = .05, n = 1000 gives power ≈ .89.
    expect(root.querySelector('[data-testid="planned-power"]')?.textContent?.trim()).toMatch(/^0\.88\d|^0\.89\d/);
  });

  it('turns two sets of shares into w and its degrees of freedom', async () => {
    await toggle('As two sets of shares');
    await type('expected', '0.5, 0.5');
    await type('detect', '0.6, 0.4');
    expect(root.querySelector('.derived')?.textContent?.replace(/\s+/g, ' ')).toContain('w = 0.200 with 1 degree of freedom');
  });

  it('says what is wrong with the inputs instead of answering', async () => {
    await type('alpha', '1.5');
    // The engine's own message (planning/power.ts).
    expect(root.querySelector('[role="alert"]')?.textContent).toContain('alpha must be between 0 and 1, got 1.5');
    expect(root.textContent).toContain('Fix the inputs above to see the curve.');
  });
});
