import Plotly from 'plotly.js-dist-min';
import createPlotlyComponent from 'react-plotly.js/factory';

// Loaded only through React.lazy: Plotly alone outweighs the rest of the application.
const PlotlyChart = createPlotlyComponent(Plotly);
export default PlotlyChart;
