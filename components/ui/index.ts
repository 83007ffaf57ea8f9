export { cn, type ClassValue } from "./cn";
export { Badge, type BadgeProps, type BadgeTone } from "./badge";
export {
  Button,
  buttonClasses,
  type ButtonProps,
  type ButtonSize,
  type ButtonVariant,
} from "./button";
export {
  Card,
  CardBody,
  CardFooter,
  CardHeader,
  type CardHeaderProps,
  type CardProps,
} from "./card";
export { Caution, DEFAULT_CAUTION, type CautionProps } from "./caution";
export { Checkbox, type CheckboxProps } from "./checkbox";
export { controlClasses, type ControlSize } from "./control";
export {
  Dialog,
  DialogClose,
  DialogContent,
  DialogDescription,
  DialogFooter,
  DialogHeader,
  DialogTitle,
  DialogTrigger,
  type DialogContentProps,
} from "./dialog";
export {
  DropdownMenu,
  DropdownMenuContent,
  DropdownMenuGroup,
  DropdownMenuItem,
  DropdownMenuLabel,
  DropdownMenuSeparator,
  DropdownMenuTrigger,
  type DropdownMenuItemProps,
} from "./dropdown-menu";
export { EmptyState, type EmptyStateProps } from "./empty-state";
export { Field, fieldIds, type FieldControlProps, type FieldProps } from "./field";
export { FormMessage, type FormMessageProps, type FormMessageTone } from "./form-message";
export { Input, type InputProps } from "./input";
export { Label, type LabelProps } from "./label";
export {
  formatNumber,
  formatQuantity,
  Quantity,
  type FormatQuantityOptions,
  type QuantityProps,
} from "./number";
export { PageHeader, type PageHeaderProps } from "./page-header";
export { pageItems, Pagination, type PageItem, type PaginationProps } from "./pagination";
export { Select, type SelectProps } from "./select";
export { Skeleton, SkeletonText, type SkeletonProps, type SkeletonTextProps } from "./skeleton";
export { Spinner, type SpinnerProps, type SpinnerSize } from "./spinner";
export { StatusPill, type StatusPillProps } from "./status-pill";
export {
  StatusShape,
  statusShapeOf,
  statusTones,
  toneTextClass,
  type StatusShapeProps,
  type StatusTone,
} from "./status-shape";
export {
  Table,
  TableCaption,
  TBody,
  Td,
  TFoot,
  Th,
  THead,
  Tr,
  type SortDirection,
  type TableProps,
  type TdProps,
  type ThProps,
  type TrProps,
} from "./table";
export { Textarea, type TextareaProps } from "./textarea";
export { toast, Toaster } from "./toaster";
export { VisuallyHidden, type VisuallyHiddenProps } from "./visually-hidden";
