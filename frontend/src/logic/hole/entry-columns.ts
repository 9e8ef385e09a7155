// The core-entry grid's columns: fixed widths, so switching the new row to true dip/dip dir. does
// not shift them, and every kind of row (saved, pending, typed) spans the same count.
export const ENTRY_COLUMNS = 12

export const entryColumnWidths = [
  '2.75rem', // #
  '6rem', // depth
  '7.75rem', // type
  '4.75rem', // alpha
  '4.75rem', // beta
  '4.75rem', // gamma
  '4.75rem', // dip
  '5.25rem', // dip direction
  '9rem', // flags
  '8rem', // condition
  '', // comment: the rest
  '4.5rem', // actions
]
