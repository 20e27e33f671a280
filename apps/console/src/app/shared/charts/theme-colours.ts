/** The theme colours a chart needs. */
export interface ChartColours {
  primary: string;
  tertiary: string;
  text: string;
  grid: string;
  surface: string;
}

/**
 * The theme's colours as plain rgb() strings for the charts: the `--mat-sys-*` tokens may be
 * written as `light-dark(…)`, which ECharts cannot read, so each is resolved through a probe element.
 */
export function themeColours(host: HTMLElement): ChartColours {
  const probe = document.createElement('span');
  probe.style.display = 'none';
  host.appendChild(probe);
  const read = (token: string, fallback: string): string => {
    probe.style.color = `var(${token}, ${fallback})`;
    return getComputedStyle(probe).color || fallback;
  };
  const colours: ChartColours = {
    primary: read('--mat-sys-primary', '#1f5f8b'),
    tertiary: read('--mat-sys-tertiary', '#8b5a1f'),
    text: read('--mat-sys-on-surface', '#1b1b1f'),
    grid: read('--mat-sys-outline-variant', '#c4c6cf'),
    surface: read('--mat-sys-surface', '#ffffff'),
  };
  probe.remove();
  return colours;
}
