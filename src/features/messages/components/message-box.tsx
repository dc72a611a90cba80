import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect, useId, useRef, useState } from 'react';
import { useForm } from 'react-hook-form';
import { useLocation } from 'react-router-dom';
import { MESSAGE_MAX_CHARS, type MessageView, type PostMessageInput, postMessageSchema } from '../../../../shared/schemas/message.ts';
import { Button, Spinner } from '../../../components/ui/button.tsx';
import { Field, TextAreaField } from '../../../components/ui/form-controls.tsx';
import { useToast } from '../../../components/ui/toast.tsx';
import { applyServerErrors } from '../../../lib/form-errors.ts';
import { useThread } from '../api/get-thread.ts';
import { useMarkRead } from '../api/mark-read.ts';
import { usePostMessage } from '../api/post-message.ts';

const when = (ms: number) => new Date(ms).toLocaleString(undefined, { year: 'numeric', month: 'short', day: 'numeric', hour: '2-digit', minute: '2-digit' });

/** One message: who, when, the text as text (never markup), and a photo thumbnail opening the full photo. */
function MessageItem({ m }: { m: MessageView }) {
  return (
    <li className={`flex flex-col gap-1 rounded-lg border p-3 ${m.mine ? 'border-thread/40 bg-thread-wash sm:ml-10' : 'border-line bg-white sm:mr-10'}`} data-testid="message">
      <p className="text-sm text-ink-soft">
        <span className="font-bold text-ink">{m.mine ? 'You' : m.authorName}</span> · <time dateTime={new Date(m.createdAt).toISOString()}>{when(m.createdAt)}</time>
      </p>
      <p className="break-words whitespace-pre-wrap">{m.body}</p>
      {m.photo ? (
        <a href={m.photo.url} target="_blank" rel="noopener" className="self-start">
          <img src={m.photo.thumbnailUrl} alt={`Sent by ${m.mine ? 'you' : m.authorName} with the message`} className="max-h-40 rounded border border-line" loading="lazy" />
        </a>
      ) : null}
    </li>
  );
}

/**
 * The "message" box of an order page: the thread between the shopper and the shop, and a form to
 * write (text and an optional photo). `with` names the other party. Opening it marks the other
 * side's messages read; a link ending in #messages (the e-mail's) scrolls here once it has loaded.
 */
export function MessageBox({ orderId, with: other }: { orderId: string; with: string }) {
  const thread = useThread(orderId);
  const markRead = useMarkRead(orderId);
  const post = usePostMessage(orderId);
  const toast = useToast();
  const headingId = useId();
  const location = useLocation();
  const sectionRef = useRef<HTMLElement>(null);
  const [photo, setPhoto] = useState<File | null>(null);
  const [fileKey, setFileKey] = useState(0);
  const form = useForm<PostMessageInput>({ resolver: zodResolver(postMessageSchema), defaultValues: { body: '' } });

  const data = thread.data;
  const unread = data?.unread ?? 0;
  const { mutate: mark } = markRead;
  // opening the thread with the other side's messages unread marks them read (and the header's count drops)
  useEffect(() => {
    if (unread > 0) mark();
  }, [unread, mark]);
  const loaded = !!data;
  useEffect(() => {
    if (loaded && location.hash === '#messages') sectionRef.current?.scrollIntoView({ block: 'start' });
  }, [loaded, location.hash]);

  const onSubmit = form.handleSubmit(async (values) => {
    try {
      await post.mutateAsync({ body: values.body, photo });
      form.reset({ body: '' });
      setPhoto(null);
      setFileKey((k) => k + 1);
      toast.success(`Sent. ${other} gets an e-mail with a link to this page.`);
    } catch (e) {
      const msg = applyServerErrors(e, form.setError, ['body']);
      if (msg) toast.error(msg);
    }
  });

  return (
    <section id="messages" ref={sectionRef} aria-labelledby={headingId} className="mt-8 flex scroll-mt-4 flex-col gap-4 rounded-lg border border-line bg-paper p-5">
      <h2 id={headingId} className="text-xl font-extrabold">
        Messages with {other}
      </h2>
      {thread.isPending ? (
        <Spinner label="Loading the messages…" />
      ) : thread.isError ? (
        <p role="alert">{thread.error.message}</p>
      ) : thread.data.messages.length === 0 ? (
        <p className="text-ink-soft">No messages yet. Ask about a colour, a spelling or a date: {other} answers here.</p>
      ) : (
        <ol className="flex flex-col gap-3" aria-label="Messages, oldest first">
          {thread.data.messages.map((m) => (
            <MessageItem key={m.id} m={m} />
          ))}
        </ol>
      )}
      {data?.full ? (
        <p className="font-semibold">This thread is full.</p>
      ) : (
        <form noValidate onSubmit={onSubmit} className="flex flex-col gap-3">
          <TextAreaField
            label="Your message"
            rows={3}
            maxLength={MESSAGE_MAX_CHARS}
            hint={`Up to ${MESSAGE_MAX_CHARS.toLocaleString()} characters.`}
            error={form.formState.errors.body?.message}
            {...form.register('body')}
          />
          <Field
            label="Add a photo (optional)"
            hint="JPEG, PNG or WebP, up to 8 MB."
            control={(c) => (
              <input
                key={fileKey}
                {...c}
                type="file"
                accept="image/jpeg,image/png,image/webp"
                onChange={(e) => setPhoto(e.currentTarget.files?.[0] ?? null)}
                className="text-sm file:mr-3 file:rounded-lg file:border-2 file:border-ink file:bg-white file:px-3 file:py-1.5 file:font-bold"
              />
            )}
          />
          <Button type="submit" pending={post.isPending} pendingLabel="Sending…" className="self-start">
            Send message
          </Button>
        </form>
      )}
    </section>
  );
}
