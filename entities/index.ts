import { Grade } from "./Grade";
import { Membership } from "./Membership";
import { Shear } from "./Shear";
import { Shop } from "./Shop";
import { User } from "./User";

export { Grade, Membership, Shear, Shop, User };

/** Every entity, for the ORM configuration. */
export const entities = [Shop, User, Membership, Shear, Grade];
