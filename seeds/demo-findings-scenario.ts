import type { Block, Inline, Paragraph } from '../shared/findings/document'
import type { SectionKey } from '../shared/findings/sections'
import type { FeatureTag, Mark, PhotoKind } from '../shared/schemas/photos'

/*
 * The invented evidence and findings of the demo's drafting cases: photographs (drawn here, not
 * taken), the observations recorded on them, and a draft that shows them as numbered figures and
 * cites the observations in its opinions.
 */

export interface DemoPhoto {
  fileName: string
  caption: string
  kind: PhotoKind
  tags: FeatureTag[]
  /** where the drawn origin sits, as shares of the width and height */
  origin: [number, number]
  micrometresPerPixel: number
  marks: Mark[]
}

export interface DemoObservation {
  text: string
  /** indexes into the case's photos */
  photos: number[]
}

/** Builds the draft's section bodies from the figure ids of the case's photos, in photo order. */
export type DemoDraft = (figureIds: string[]) => Partial<Record<SectionKey, Block[]>>

export interface DemoFindings {
  photos: DemoPhoto[]
  observations: DemoObservation[]
  draft: DemoDraft
}

const text = (value: string): Inline => ({ type: 'text', text: value })
const ref = (figureId: string): Inline => ({ type: 'figureRef', attrs: { figureId } })
export const paragraph = (...content: (string | Inline)[]): Paragraph => ({
  type: 'paragraph',
  content: content.map((part) => (typeof part === 'string' ? text(part) : part)),
})
const figure = (figureId: string, photoId: number, caption: string): Block => ({
  type: 'figure',
  attrs: { figureId, photoId, caption },
})
const opinion = (observations: number[], body: string, assumptions = ''): Block => ({
  type: 'opinion',
  attrs: { observations, assumptions },
  content: [paragraph(body)],
})

/** Figures point at photos by id; the seed fills the id in once the photos are stored. */
export const PHOTO_ID_PLACEHOLDER = -1
const fig = (figureId: string, caption: string) => figure(figureId, PHOTO_ID_PLACEHOLDER, caption)

const arrow = (x1: number, y1: number, x2: number, y2: number): Mark => ({
  kind: 'arrow',
  from: { x: x1, y: y1 },
  to: { x: x2, y: y2 },
})
const label = (x: number, y: number, value: string): Mark => ({
  kind: 'label',
  at: { x, y },
  text: value,
})

export const DEMO_FINDINGS: Record<string, DemoFindings> = {
  'Transfer pump shaft fracture': {
    photos: [
      {
        fileName: 'shaft-fracture-face.jpg',
        caption: 'Fracture face at the keyway run-out',
        kind: 'macro',
        tags: ['origin', 'beach_marks', 'final_overload'],
        origin: [0.5, 0.12],
        micrometresPerPixel: 40,
        marks: [arrow(420, 260, 580, 130), label(300, 290, 'Origin')],
      },
      {
        fileName: 'shaft-keyway-end.jpg',
        caption: 'Keyway end behind the coupling, side view',
        kind: 'overall',
        tags: ['secondary_cracking'],
        origin: [0.3, 0.5],
        micrometresPerPixel: 120,
        marks: [arrow(200, 700, 340, 470), label(120, 740, 'Sharp keyway corner')],
      },
    ],
    observations: [
      {
        text: 'Beach marks on the fracture face converge on the corner of the keyway run-out.',
        photos: [0],
      },
      {
        text: 'The final overload zone covers about a sixth of the section, opposite the keyway.',
        photos: [0],
      },
      {
        text: 'The keyway ends in a sharp corner; no radius was machined at the run-out.',
        photos: [1],
      },
    ],
    draft: ([face, keyway]) => ({
      summary: [
        paragraph(
          'The pump shaft broke by high-cycle fatigue from the sharp corner at the end of the keyway. ',
          'The material was not examined for conformity in this case.',
        ),
      ],
      background: [
        paragraph('The service history as the client recorded it:'),
        { type: 'liveBlock', attrs: { kind: 'service_history' } },
      ],
      visual: [
        fig(keyway!, 'Keyway end behind the coupling; the arrow points at the sharp corner.'),
        paragraph('The keyway ends abruptly behind the coupling (', ref(keyway!), ').'),
      ],
      fractography: [
        fig(face!, 'Fracture face; beach marks run from the origin at the keyway corner.'),
        paragraph(
          'Beach marks cover most of the section and converge on the keyway corner (',
          ref(face!),
          '); the final overload zone is small.',
        ),
      ],
      discussion: [
        opinion(
          [1, 3],
          'The crack started at the unradiused keyway corner, where bending and torsion concentrate, and grew by fatigue over many cycles.',
          'Operating loads as the maintenance records give them.',
        ),
      ],
      conclusions: [
        opinion(
          [1, 2],
          'High-cycle fatigue under low nominal stress caused the fracture; it was not an overload.',
        ),
      ],
      recommendations: [
        opinion([3], 'Machine a radius at the keyway run-out of the replacement shafts.'),
      ],
    }),
  },
  'Cracked rope sheave on luffing hoist': {
    photos: [
      {
        fileName: 'sheave-rim-crack.jpg',
        caption: 'Crack across the sheave rim at the groove root',
        kind: 'macro',
        tags: ['origin', 'beach_marks'],
        origin: [0.2, 0.8],
        micrometresPerPixel: 60,
        marks: [arrow(500, 500, 280, 700), label(520, 480, 'Groove root')],
      },
    ],
    observations: [
      {
        text: 'A crack runs radially through the rim from the groove root, with progression marks.',
        photos: [0],
      },
      { text: 'The groove is worn to a profile narrower than the rope.', photos: [0] },
    ],
    draft: ([rim]) => ({
      fractography: [
        fig(rim!, 'Crack across the rim; progression marks start at the groove root.'),
        paragraph('The crack starts at the groove root (', ref(rim!), ').'),
      ],
      discussion: [
        opinion(
          [1, 2],
          'The worn, narrow groove pinched the rope and loaded the rim at each pass: the crack grew by fatigue.',
        ),
      ],
    }),
  },
  'Sheared boom foot bolt': {
    photos: [
      {
        fileName: 'bolt-shear-face.jpg',
        caption: 'Shear face of the boom foot bolt',
        kind: 'macro',
        tags: ['dimples', 'shear_lip'],
        origin: [0.5, 0.5],
        micrometresPerPixel: 50,
        marks: [label(480, 430, 'Smeared shear face')],
      },
    ],
    observations: [
      {
        text: 'The fracture face is flat and smeared in one direction, with a shear lip.',
        photos: [0],
      },
      { text: 'Two neighbouring bolts of the joint were found loose.', photos: [] },
    ],
    draft: ([face]) => ({
      fractography: [
        fig(face!, 'Shear face of the bolt, smeared in the direction of the boom load.'),
        paragraph('The face is smeared in one direction (', ref(face!), ').'),
      ],
      discussion: [
        opinion(
          [1, 2],
          'With its neighbours loose, the bolt carried the joint alone and sheared in one overload.',
          'The bolts were tightened to the specified preload at assembly.',
        ),
      ],
    }),
  },
}
