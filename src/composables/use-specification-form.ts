import { reactive } from 'vue'
import { createSpecification, updateSpecification } from '@/api/specifications'
import { useFormErrors } from '@/composables/use-form-errors'
import {
  emptyBand,
  emptyRecord,
  recordFormOf,
  recordOf,
  type RecordForm,
} from '@/components/specifications/band-form'
import {
  SpecificationCreate,
  SpecificationUpdate,
  type Specification,
} from '../../shared/schemas/specifications'

/**
 * A library record being written or changed: checked with the shared schema before sending, the
 * server's refusals beside the fields; a change names the version it was read at.
 */
export function useSpecificationForm(
  start: Specification | null,
  saved: (r: Specification) => void,
) {
  const errors = useFormErrors()
  const form = reactive<RecordForm>(start ? recordFormOf(start) : emptyRecord())

  async function submit(): Promise<void> {
    const value = recordOf(form)
    if (start === null) {
      const input = errors.validate(SpecificationCreate, value)
      if (!input) return
      await errors.send(async () => saved(await createSpecification(input)))
      return
    }
    const change = errors.validate(SpecificationUpdate, {
      ...(value as object),
      version: start.version,
    })
    if (!change) return
    await errors.send(async () => saved(await updateSpecification(start.id, change)))
  }

  return {
    form,
    fieldErrors: errors.fieldErrors,
    formError: errors.formError,
    sending: errors.sending,
    submit,
    addBand: () => form.bands.push(emptyBand()),
    removeBand: (index: number) => form.bands.splice(index, 1),
  }
}
