import { FormProblems, type FieldProblem } from '../../../components/ui/form-problems';

/**
 * A refused action, right where the agent pressed: the shared error summary, which takes focus and names each field
 * and the rule it broke (with a link to the field when its id is given).
 */
export function Problem(props: { error: unknown; problems?: FieldProblem[] | null; labels?: Record<string, string>; fieldIds?: Record<string, string>; takeFocus?: boolean }) {
  return <FormProblems {...props} />;
}
