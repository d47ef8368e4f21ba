import type { ZodType } from 'zod'
import type { Rule } from 'ant-design-vue/es/form'

/**
 * ant-design-vue form rules from a zod schema: each field is checked by the same schema the
 * API route uses, so the form and the server never disagree about what is valid.
 */
export function rulesFrom(schema: ZodType, fields: string[], model: () => Record<string, unknown>) {
  const rules: Record<string, Rule[]> = {}
  for (const field of fields) {
    rules[field] = [{
      trigger: 'change',
      validator: async () => {
        const result = schema.safeParse(model())
        if (result.success) return
        const issue = result.error.issues.find((i) => i.path[0] === field)
        if (issue) throw new Error(issue.message)
      },
    }]
  }
  return rules
}
