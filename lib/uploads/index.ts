export {
  ACCEPTED_TYPES,
  acceptAttribute,
  acceptedTypesInWords,
  DOCUMENT_TYPES,
  EVIDENCE_MAX_BYTES,
  EXTENSIONS,
  IMAGE_TYPES,
  TYPE_WORDS,
  checkUploadSize,
  checkUploadType,
  formatBytes,
  isImageType,
  type AcceptedType,
  type EvidenceUploadKind,
  type UploadAccepted,
  type UploadRefusal,
} from "./checks";
export { displayFileName, downloadName, evidenceStorageKey } from "./names";
