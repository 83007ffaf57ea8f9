export { BudgetActualChart, type BudgetBar } from "./budget-actual-chart";
export { ChartFigure } from "./chart-figure";
export { ReadinessOverTimeChart, VarianceClosingChart, type TrendPoint } from "./fleet-trend-charts";
export { SpendByMonthChart, type SpendMonth, type SpendSeries } from "./spend-by-month-chart";
export { dayLabel, dollarsOf, monthLabel, shortDollars } from "./format";
