/**
 * Public entry points of the voting engine, for the API, the pages, a worker and the CLI. Everything
 * here is pure and synchronous; results are JSON-serialisable (counts via countToJson).
 */
export { analyseOrders, ordersInputSchema, type OrdersAnalysis, type OrdersInput, type AnalyseOptions } from "./analyse-orders.ts";
export { analyseAgendas, agendasInputSchema, type AgendasReport, type AgendasInput } from "./agendas-report.ts";
export { majorityFromInput, majorityInputSchema, parsedMajorityGraph, type MajorityInput } from "./majority-input.ts";
export { majorityReport, type MajorityReport } from "./majority-report.ts";
export { majorityGraph, graphFromMargins, type MajorityGraph } from "./majority-graph.ts";
export { condorcetWinner } from "./condorcet-winner.ts";
export { topCycle } from "./top-cycle.ts";
export { schwartzSet } from "./schwartz-set.ts";
export { uncoveredSet, UNCOVERED_VARIANTS, type UncoveredVariant } from "./uncovered-set.ts";
export { banksSet, BANKS_MAX_EXACT, BANKS_MAX_NODES, type BanksResult } from "./banks-set.ts";
export { sincereAmendment, shepsleWeingast } from "./amendment-agenda.ts";
export { sincereSuccessive, sophisticatedSuccessive } from "./successive-agenda.ts";
export { amendmentTree, successiveTree, twoStageTree, sophisticatedValue, votePath, type VotingTree, type VoteRecord } from "./voting-tree.ts";
export { precedence, availableMask, isLegalOrder, type Precedence, type OrderWindow } from "./precedence.ts";
export { questionOrderRules, questionPrecedence, questionConstraints, type QuestionOrderRules } from "./order-constraints.ts";
export { legalOrders, legalOrderPage } from "./legal-orders.ts";
export { countOrders, countLegalOrders, type OrderMachine, type RunControl } from "./count-orders.ts";
export { countToJson, type Count, type JsonCount } from "./count-json.ts";
export { amendmentTreeModel, type AmendmentTreeModel } from "./amendment-versions.ts";
export { spatialSchema, scaleSpatial, spatialTally, type SpatialInput } from "./spatial-profile.ts";
export { winSet, type WinSet } from "./win-set.ts";
export { corePoint, type CoreResult } from "./core-point.ts";
