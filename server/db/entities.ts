import { AppSetting } from '@/server/modules/settings/app-setting.entity';
import { AuditEvent } from '@/server/modules/audit/audit-event.entity';
import { AuthThrottle } from '@/server/modules/auth/auth-throttle.entity';
import { EmailToken } from '@/server/modules/auth/email-token.entity';
import { User } from '@/server/modules/auth/user.entity';
import { UserSession } from '@/server/modules/auth/user-session.entity';
import { ResearchGroup } from '@/server/modules/groups/group.entity';
import { GroupInvitation } from '@/server/modules/groups/invitation.entity';
import { GroupMembership } from '@/server/modules/groups/membership.entity';
import { DevOutboxMessage } from '@/server/modules/mail/outbox-message.entity';
import { Citation } from '@/server/modules/library/citation.entity';
import { Complex } from '@/server/modules/library/complex.entity';
import { LibraryLigand } from '@/server/modules/library/ligand.entity';
import { Measurement } from '@/server/modules/library/measurement.entity';
import { ComplexReview } from '@/server/modules/library/review.entity';
import { ComplexRevision } from '@/server/modules/library/revision.entity';
import { Attachment } from '@/server/modules/attachments/attachment.entity';
import { ImportJob } from '@/server/modules/exchange/import-job.entity';
import { UserMailPreference } from '@/server/modules/notifications/mail-preference.entity';
import { UserLibraryPreference } from '@/server/modules/library/library-preference.entity';

/** Every entity the ORM knows; a module adds its entities here. */
export const entities = [
  AppSetting,
  User,
  UserSession,
  EmailToken,
  AuthThrottle,
  ResearchGroup,
  GroupMembership,
  GroupInvitation,
  AuditEvent,
  DevOutboxMessage,
  Citation,
  LibraryLigand,
  Complex,
  Measurement,
  ComplexRevision,
  ComplexReview,
  ImportJob,
  Attachment,
  UserMailPreference,
  UserLibraryPreference,
];
