import { z } from 'zod/mini'
import { idOf, IsoDate, optionalText } from './common'

export const PHOTO_KINDS = ['overall', 'macro', 'stereo', 'sem', 'metallographic', 'other'] as const
export type PhotoKind = (typeof PHOTO_KINDS)[number]

export const PHOTO_KIND_LABELS: Record<PhotoKind, string> = {
  overall: 'Overall',
  macro: 'Macro',
  stereo: 'Stereo microscope',
  sem: 'SEM',
  metallographic: 'Metallographic section',
  other: 'Other',
}

/** Features a fractographer names on a photo (common practice in failure analysis). */
export const FEATURE_TAGS = [
  'origin',
  'beach_marks',
  'ratchet_marks',
  'striations',
  'chevrons',
  'river_marks',
  'dimples',
  'cleavage_facets',
  'intergranular_facets',
  'shear_lip',
  'final_overload',
  'corrosion_products',
  'secondary_cracking',
  'wear',
  'other',
] as const
export type FeatureTag = (typeof FEATURE_TAGS)[number]

export const FEATURE_TAG_LABELS: Record<FeatureTag, string> = {
  origin: 'Origin',
  beach_marks: 'Beach or progression marks',
  ratchet_marks: 'Ratchet marks',
  striations: 'Striations',
  chevrons: 'Chevrons',
  river_marks: 'River marks',
  dimples: 'Dimples',
  cleavage_facets: 'Cleavage facets',
  intergranular_facets: 'Intergranular facets',
  shear_lip: 'Shear lip',
  final_overload: 'Final overload zone',
  corrosion_products: 'Corrosion products',
  secondary_cracking: 'Secondary cracking',
  wear: 'Wear',
  other: 'Other',
}

/** Image types accepted as photographs, recognised by their content. */
export const PHOTO_MEDIA_TYPES = ['image/jpeg', 'image/png', 'image/tiff', 'image/webp'] as const
export const MAX_PHOTO_BYTES = 80 * 1024 * 1024
/** Decoded size above which an image is refused before decoding (decompression bombs). */
export const MAX_PHOTO_PIXELS = 120_000_000

/** A position on the upright original, in its pixels. */
const coordinate = z
  .number({ error: 'Use a number of pixels.' })
  .check(
    z.minimum(-100_000, 'A mark lies too far outside the photo.'),
    z.maximum(200_000, 'A mark lies too far outside the photo.'),
  )
const point = { x: coordinate, y: coordinate }

export const Mark = z.discriminatedUnion(
  'kind',
  [
    z.strictObject({
      kind: z.literal('arrow'),
      from: z.strictObject(point),
      to: z.strictObject(point),
    }),
    z.strictObject({
      kind: z.literal('circle'),
      centre: z.strictObject(point),
      radius: z.number().check(z.positive('A circle needs a radius.'), z.maximum(200_000)),
    }),
    z.strictObject({
      kind: z.literal('outline'),
      points: z
        .array(z.strictObject(point))
        .check(z.minLength(2, 'An outline needs two points or more.'), z.maxLength(500)),
    }),
    z.strictObject({
      kind: z.literal('label'),
      at: z.strictObject(point),
      text: z
        .string()
        .check(
          z.trim(),
          z.minLength(1, 'A label needs text.'),
          z.maxLength(200, 'A label is at most 200 characters.'),
        ),
    }),
  ],
  { error: 'A mark is an arrow, a circle, an outline or a label.' },
)
export type Mark = z.output<typeof Mark>

/**
 * The photo's scale: micrometres per pixel of the upright original, either entered or found from
 * a line drawn over a known length (kept, so the calibration can be checked later).
 */
export const PhotoScale = z.strictObject({
  micrometresPerPixel: z
    .number({ error: 'Enter the length per pixel.' })
    .check(z.positive('The length per pixel must be above zero.'), z.maximum(1_000_000)),
  line: z._default(
    z.nullable(
      z.strictObject({
        from: z.strictObject(point),
        to: z.strictObject(point),
        micrometres: z.number().check(z.positive('The known length must be above zero.')),
      }),
    ),
    null,
  ),
})
export type PhotoScale = z.output<typeof PhotoScale>

export const PhotoUpdate = z.strictObject({
  version: z.int({ error: 'Send the version of the photo you edited.' }).check(z.positive()),
  caption: z.optional(optionalText(1000, 'Caption')),
  kind: z.optional(z.enum(PHOTO_KINDS, { error: 'Choose the kind of photo.' })),
  magnification: z.optional(
    z.nullable(
      z
        .number({ error: 'Magnification must be a number.' })
        .check(z.positive('Magnification must be above zero.'), z.maximum(10_000_000)),
    ),
  ),
  sampleId: z.optional(z.nullable(idOf('Choose a sample of this case.'))),
  takenBy: z.optional(optionalText(191, 'Taken by')),
  takenOn: z.optional(z.nullable(IsoDate)),
  tags: z.optional(
    z
      .array(z.enum(FEATURE_TAGS, { error: 'Choose features from the list.' }))
      .check(z.maxLength(FEATURE_TAGS.length)),
  ),
  clientVisible: z.optional(z.boolean({ error: 'Say whether the client may see this photo.' })),
  scale: z.optional(z.nullable(PhotoScale)),
  marks: z.optional(z.array(Mark).check(z.maxLength(200, 'At most 200 marks on a photo.'))),
})
export type PhotoUpdate = z.output<typeof PhotoUpdate>

/** The multipart fields beside the file. */
export const PhotoUploadFields = z.strictObject({
  sampleId: z.optional(idOf('Choose a sample of this case.')),
})

export const PhotoListQuery = z.strictObject({
  sampleId: z.optional(idOf('Choose a sample of this case.')),
})

export interface Photo {
  id: number
  caseId: number
  sampleId: number | null
  fileName: string
  mediaType: string
  size: number
  sha256: string
  width: number
  height: number
  displayWidth: number
  displayHeight: number
  caption: string | null
  kind: PhotoKind
  magnification: number | null
  takenBy: string | null
  takenOn: string | null
  tags: FeatureTag[]
  clientVisible: boolean
  scale: PhotoScale | null
  marks: Mark[]
  version: number
  uploadedBy: number
  createdAt: string
  updatedAt: string
}
