/**
 * The "new project" form in happy-dom: the route's zod schema (shared/types/projects.ts) checks the
 * input before anything is sent, the store is called with the parsed (trimmed) data, and a refusal
 * from the server is shown in the form.
 */
import { describe, expect, it, vi, beforeEach } from 'vitest'
import { mockNuxtImport, mountSuspended } from '@nuxt/test-utils/runtime'
import { flushPromises } from '@vue/test-utils'
import NewProjectForm from '../../app/components/project/NewProjectForm.vue'

const create = vi.fn<(body: { name: string, description: string }) => Promise<number>>()
mockNuxtImport('useProjectsStore', () => () => ({ create }))

beforeEach(() => { create.mockReset() })

async function fill(name: string, description = '') {
  const w = await mountSuspended(NewProjectForm)
  await w.find('#project-name').setValue(name)
  await w.find('#project-description').setValue(description)
  await w.find('form').trigger('submit')
  await flushPromises()
  return w
}

describe('NewProjectForm', () => {
  it('refuses an empty name with the schema message and sends nothing', async () => {
    const w = await fill('   ')
    expect(w.find('.field-error').text()).toBe('Give the project a name.')
    expect(create).not.toHaveBeenCalled()
    expect(w.emitted('created')).toBeUndefined()
  })

  it('refuses a name of 121 characters (the limit is 120)', async () => {
    const w = await fill('x'.repeat(121))
    expect(w.find('.field-error').text()).toBe('Use at most 120 characters.')
    expect(create).not.toHaveBeenCalled()
  })

  it('sends the trimmed values and emits the new id', async () => {
    create.mockResolvedValue(42)
    const w = await fill('  Minimal cells  ', ' shear families ')
    expect(create).toHaveBeenCalledWith({ name: 'Minimal cells', description: 'shear families' })
    expect(w.emitted('created')).toEqual([[42]])
    expect(w.find('.field-error').exists()).toBe(false)
  })

  it("shows the server's refusal and lets the user try again", async () => {
    create.mockRejectedValue({ statusCode: 403, data: { message: 'Viewers cannot create projects here.' } })
    const w = await fill('Minimal cells')
    expect(w.find('[data-testid=error-state]').text()).toContain('Viewers cannot create projects here.')
    expect(w.find('button[type=submit]').attributes('disabled')).toBeUndefined()
    expect(w.emitted('created')).toBeUndefined()
  })
})
