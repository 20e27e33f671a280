/**
 * The parts of ECharts the result charts use, registered once. Imported only through a dynamic
 * import, so the charting code lands in its own lazily loaded chunk. The SVG renderer keeps text
 * crisp and lets a chart be saved as SVG.
 */
import { BarChart, CustomChart, LineChart, ScatterChart } from 'echarts/charts';
import { AriaComponent, GridComponent, LegendComponent, MarkLineComponent, TitleComponent, TooltipComponent } from 'echarts/components';
import * as echarts from 'echarts/core';
import { SVGRenderer } from 'echarts/renderers';

echarts.use([BarChart, CustomChart, LineChart, ScatterChart, AriaComponent, GridComponent, LegendComponent, MarkLineComponent, TitleComponent, TooltipComponent, SVGRenderer]);

export { echarts };
