// plotly.js-dist-min ships no types; only the calls the chart view makes are declared.
declare module 'plotly.js-dist-min' {
  export interface PlotlyStatic {
    react(root: HTMLElement, data: object[], layout?: object, config?: object): Promise<unknown>;
    purge(root: HTMLElement): void;
    Plots: { resize(root: HTMLElement): void };
  }
  const Plotly: PlotlyStatic;
  export default Plotly;
}
