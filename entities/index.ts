import type { InferEntity } from "@mikro-orm/core";
import { ApiKey } from "./ApiKey";
import { ConsoleSession } from "./ConsoleSession";
import { Delivery } from "./Delivery";
import { DeliveryAttempt } from "./DeliveryAttempt";
import { Event } from "./Event";
import { Grade } from "./Grade";
import { IdempotencyRecord } from "./IdempotencyRecord";
import { Invitation } from "./Invitation";
import { Membership } from "./Membership";
import { Plan } from "./Plan";
import { Program } from "./Program";
import { RequestLog } from "./RequestLog";
import { Shear } from "./Shear";
import { Shop } from "./Shop";
import { SignInAttempt } from "./SignInAttempt";
import { StockItem } from "./StockItem";
import { StockReservation } from "./StockReservation";
import { User } from "./User";
import { WebhookEndpoint } from "./WebhookEndpoint";

export {
  ApiKey,
  ConsoleSession,
  Delivery,
  DeliveryAttempt,
  Event,
  Grade,
  IdempotencyRecord,
  Invitation,
  Membership,
  Plan,
  Program,
  RequestLog,
  Shear,
  Shop,
  SignInAttempt,
  StockItem,
  StockReservation,
  User,
  WebhookEndpoint,
};

export type ApiKeyEntity = InferEntity<typeof ApiKey>;
export type DeliveryEntity = InferEntity<typeof Delivery>;
export type WebhookEndpointEntity = InferEntity<typeof WebhookEndpoint>;
export type EventEntity = InferEntity<typeof Event>;
export type ProgramEntity = InferEntity<typeof Program>;
export type PlanEntity = InferEntity<typeof Plan>;
export type GradeEntity = InferEntity<typeof Grade>;
export type ShearEntity = InferEntity<typeof Shear>;
export type ShopEntity = InferEntity<typeof Shop>;
export type StockItemEntity = InferEntity<typeof StockItem>;
export type StockReservationEntity = InferEntity<typeof StockReservation>;

/** Every entity, for the ORM configuration. */
export const entities = [
  Shop,
  User,
  Membership,
  Shear,
  Grade,
  ApiKey,
  RequestLog,
  IdempotencyRecord,
  Program,
  Event,
  WebhookEndpoint,
  Delivery,
  DeliveryAttempt,
  Invitation,
  Plan,
  ConsoleSession,
  SignInAttempt,
  StockItem,
  StockReservation,
];
