import type { CustomTableLayout } from 'pdfmake/interfaces'
import { INK } from './styles'

/** Thin grey rules, a little padding: dense but readable lab tables. */
export const TABLE_LAYOUT: CustomTableLayout = {
  hLineWidth: () => 0.5,
  vLineWidth: () => 0.5,
  hLineColor: () => INK.rule,
  vLineColor: () => INK.rule,
  paddingLeft: () => 4,
  paddingRight: () => 4,
  paddingTop: () => 2.5,
  paddingBottom: () => 2.5,
}
