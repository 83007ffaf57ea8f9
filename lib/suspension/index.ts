export {
  type AxleLoadOverStandard,
  type SuspensionItem,
  constantLoadByAxle,
  variableLoadByAxle,
} from "./loadByAxle";
export {
  DEFAULT_SOFT_MARGIN_KG,
  DEFAULT_STIFF_MARGIN_KG,
  type SpringAdvice,
  type SpringAdviceInput,
  type SpringVerdict,
  springAdvice,
} from "./springAdvice";
