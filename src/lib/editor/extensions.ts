// The one list of editor extensions: the browser editor and the server's validation and rendering share it,
// so the server accepts exactly the documents the editor can make.
import StarterKit from '@tiptap/starter-kit';
import { TaskList, TaskItem } from '@tiptap/extension-list';
import Image from '@tiptap/extension-image';
import type { Extensions } from '@tiptap/core';
import { isSafeHref } from './links';

/**
 * A picture in its own block, kept to `src`, `alt` and `title` (no sizes, styles or classes). The server accepts only
 * this record's own attachment addresses as `src` (see `isAttachmentSrc`); the editor has no button to add one, so
 * images come from imported documents.
 */
const RecordImage = Image.extend({
  addAttributes() {
    return { src: { default: null }, alt: { default: null }, title: { default: null } };
  },
}).configure({ inline: false, allowBase64: false, resize: false, HTMLAttributes: { loading: 'lazy' } });

export function recordExtensions(): Extensions {
  return [
    StarterKit.configure({
      heading: { levels: [2, 3] },
      link: {
        openOnClick: false,
        autolink: true,
        protocols: ['http', 'https', 'mailto'],
        defaultProtocol: 'https',
        isAllowedUri: (url) => isSafeHref(url),
        HTMLAttributes: { rel: 'noopener noreferrer nofollow', target: null },
      },
    }),
    TaskList,
    TaskItem.configure({ nested: true }),
    RecordImage,
  ];
}
