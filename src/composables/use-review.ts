import { computed, ref, watch, type Ref } from 'vue'
import {
  addComment,
  approveDraft,
  fetchDraftForReview,
  fetchReview,
  listComments,
  requestRevisions,
  resolveComment,
  submitForReview,
  type ReviewStepResult,
} from '@/api/review'
import { issueReport } from '@/api/reports'
import { useCaseFileStore } from '@/stores/case-file'
import type { FindingsView } from '../../shared/schemas/findings'
import type { ReviewComment, ReviewCommentCreate, ReviewView } from '../../shared/schemas/review'

/** A first comment with its replies, in the order they were written. */
export interface CommentThread {
  first: ReviewComment
  replies: ReviewComment[]
}

function threadsOf(comments: readonly ReviewComment[]): CommentThread[] {
  const threads = new Map<number, CommentThread>()
  for (const comment of comments) {
    if (comment.parentId === null) threads.set(comment.id, { first: comment, replies: [] })
    else threads.get(comment.parentId)?.replies.push(comment)
  }
  return [...threads.values()]
}

/** The review panel's state: the draft as the reviewer reads it, the conversation, the steps. */
export function useReview(caseId: Ref<number>) {
  const caseFile = useCaseFileStore()
  const review = ref<ReviewView>()
  const draft = ref<FindingsView>()
  const comments = ref<ReviewComment[]>([])
  const busy = ref(false)
  const threads = computed(() => threadsOf(comments.value))

  async function load(): Promise<void> {
    if (!caseId.value) return
    ;[review.value, draft.value, comments.value] = await Promise.all([
      fetchReview(caseId.value),
      fetchDraftForReview(caseId.value),
      listComments(caseId.value),
    ])
  }
  watch(caseId, () => void load(), { immediate: true })

  /** Runs a step, then shows the case and the review as they now are. */
  async function run(action: () => Promise<ReviewStepResult | unknown>): Promise<void> {
    busy.value = true
    try {
      await action()
      await Promise.all([load(), caseFile.load(caseId.value)])
    } finally {
      busy.value = false
    }
  }

  return {
    review,
    draft,
    comments,
    threads,
    busy,
    load,
    submit: () => run(() => submitForReview(caseId.value)),
    requestRevisions: (reason: string) => run(() => requestRevisions(caseId.value, reason)),
    approve: () => run(() => approveDraft(caseId.value)),
    issue: () => run(() => issueReport(caseId.value)),
    comment: async (input: ReviewCommentCreate) => {
      await addComment(caseId.value, input)
      comments.value = await listComments(caseId.value)
    },
    resolve: async (commentId: number) => {
      await resolveComment(caseId.value, commentId)
      comments.value = await listComments(caseId.value)
    },
  }
}
