/** Block Kit types, taken from the Slack SDK that @slack/bolt ships (the project depends on bolt only). */
import type { types } from '@slack/bolt';

export type KnownBlock = types.KnownBlock;
export type SectionBlock = types.SectionBlock;
export type ContextBlock = types.ContextBlock;
export type ActionsBlock = types.ActionsBlock;
export type HeaderBlock = types.HeaderBlock;
export type InputBlock = types.InputBlock;
export type Button = types.Button;
export type MrkdwnElement = types.MrkdwnElement;
export type PlainTextElement = types.PlainTextElement;
export type ModalView = types.ModalView;
export type PlainTextOption = types.PlainTextOption;
