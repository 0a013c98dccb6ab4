import type { ExactExpression } from "@/lib/api-contract";

// The engine leaves out the TeX and compact forms of a result above its print term limit: the expanded form stands in.
export const expandedTex = (form: ExactExpression) => form.tex ?? form.infix;
export const compactTex = (form: ExactExpression) => form.compactTex ?? expandedTex(form);
export const compactText = (form: ExactExpression) => form.compact ?? form.infix;
