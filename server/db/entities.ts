import { AppSetting } from '@/server/modules/settings/app-setting.entity';

/** Every entity the ORM knows; a module adds its entities here. */
export const entities = [AppSetting];
