// The shop's settings and calendar overrides, read by every module inside its own transaction.
export { loadCalendarOverrides, loadShopSettings, saveShopSettings, type ShopSettingsRecord } from './settings.repo';
