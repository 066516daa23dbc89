'use server';

import { unsubscribe } from '@/lib/follows/follows';

export interface UnsubscribeState {
  done?: boolean;
  teamName?: string;
  message?: string;
}

// A button, not the GET of the link, stops the mails: mail scanners open links and must not unsubscribe anyone.
export async function unsubscribeAction(_prev: UnsubscribeState, formData: FormData): Promise<UnsubscribeState> {
  const token = String(formData.get('token') ?? '');
  const result = await unsubscribe(token);
  if (!result) return { message: 'This link is no longer valid: you may already have stopped these mails.' };
  return { done: true, teamName: result.teamName };
}
