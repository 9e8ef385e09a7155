// Set colours live once in schema/vocabulary.ts, shared with the design pack's nets.
export {
  setColour,
  setPalette,
  unassignedSetColour as unassignedColour,
} from '../../../../schema/vocabulary'
