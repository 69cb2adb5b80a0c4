import { describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { LIMITS } from '@basinwright/common';
import ProjectForm from '../../web/src/components/ProjectForm.vue';
import { ApiError } from '../../web/src/api/client';
import type { ProjectBody } from '../../web/src/api/projects';
import { helpFor } from './form-help';

function mountForm(
  save: (values: ProjectBody) => Promise<unknown>,
  initial?: Partial<ProjectBody>,
) {
  return mount(ProjectForm, { props: { save, initial }, attachTo: document.body });
}

async function settle(): Promise<void> {
  // vee-validate validates asynchronously and antd animates the help text in.
  await flushPromises();
  await new Promise((resolve) => setTimeout(resolve, 0));
  await flushPromises();
}

describe('ProjectForm with the shared project schema', () => {
  it('refuses an empty name with the schema message and does not save', async () => {
    const save = vi.fn().mockResolvedValue(undefined);
    const wrapper = mountForm(save);
    await wrapper.find('form').trigger('submit');
    await settle();
    expect(helpFor(wrapper, 'Project name')).toBe('Enter a project name.');
    expect(save).not.toHaveBeenCalled();
    wrapper.unmount();
  });

  it('refuses a name longer than the shared limit', async () => {
    const save = vi.fn().mockResolvedValue(undefined);
    const wrapper = mountForm(save);
    await wrapper.find('input').setValue('x'.repeat(LIMITS.projectNameMaxLength + 1));
    await wrapper.find('form').trigger('submit');
    await settle();
    expect(helpFor(wrapper, 'Project name')).toBe(
      `A project name has at most ${LIMITS.projectNameMaxLength} characters.`,
    );
    expect(save).not.toHaveBeenCalled();
    wrapper.unmount();
  });

  it('sends the cast values (trimmed, defaults filled) when valid', async () => {
    const save = vi.fn().mockResolvedValue(undefined);
    const wrapper = mountForm(save);
    const inputs = wrapper.findAll('input[type="text"], input:not([type])');
    await inputs[0]!.setValue('  Fenwick Mill Pond — auxiliary spillway outlet  ');
    await inputs[1]!.setValue('Fenwick Estates');
    await wrapper.find('form').trigger('submit');
    await settle();
    expect(save).toHaveBeenCalledTimes(1);
    expect(save.mock.calls[0]![0]).toEqual({
      name: 'Fenwick Mill Pond — auxiliary spillway outlet',
      client: 'Fenwick Estates',
      location: '',
      units: 'SI',
      status: 'draft',
      notes: '',
    });
    expect(helpFor(wrapper, 'Project name')).toBeNull();
    wrapper.unmount();
  });

  it('starts from the given values when editing', async () => {
    const save = vi.fn().mockResolvedValue(undefined);
    const wrapper = mountForm(save, {
      name: 'Caldwell Run culvert outlet',
      units: 'US',
      status: 'in review',
    });
    await wrapper.find('form').trigger('submit');
    await settle();
    expect(save.mock.calls[0]![0]).toMatchObject({
      name: 'Caldwell Run culvert outlet',
      units: 'US',
      status: 'in review',
    });
    wrapper.unmount();
  });

  it("puts a server 422's field messages under the fields", async () => {
    const save = vi.fn().mockRejectedValue(
      new ApiError(422, 'validation_error', 'Please check the form.', {
        location: 'Location is not recognised.',
      }),
    );
    const wrapper = mountForm(save, { name: 'Weir outlet' });
    await wrapper.find('form').trigger('submit');
    await settle();
    expect(save).toHaveBeenCalledTimes(1);
    expect(helpFor(wrapper, 'Location')).toBe('Location is not recognised.');
    expect(wrapper.find('[data-test="form-error"]').exists()).toBe(false);
    wrapper.unmount();
  });

  it('shows other server failures above the form', async () => {
    const save = vi
      .fn()
      .mockRejectedValue(new ApiError(500, 'internal_error', 'Something went wrong on our side.'));
    const wrapper = mountForm(save, { name: 'Weir outlet' });
    await wrapper.find('form').trigger('submit');
    await settle();
    expect(wrapper.find('[data-test="form-error"]').text()).toContain(
      'Something went wrong on our side.',
    );
    wrapper.unmount();
  });
});
