import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource } from 'typeorm';
import { ClinicSettingsService } from '../clinic/clinic-settings.service';
import { AppConfig } from '../config/app-config';
import { findWebAppFonts, type WebAppFonts } from '../web-app/web-app-fonts';
import type { StopPageClinic, StopPageContext } from './stop-page';

/** What the stop pages name: the clinic from clinic settings, the client's preferred name, the fonts. */
@Injectable()
export class StopPageContextService {
  // The build does not change while the API runs: looked up once, on the first stop page.
  private fonts: WebAppFonts | null = null;

  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly clinicSettings: ClinicSettingsService,
    private readonly config: AppConfig,
  ) {}

  /** The clinic and the fonts (for a page about no known recipient). */
  async clinic(): Promise<StopPageClinic> {
    this.fonts ??= findWebAppFonts(this.config.webAppDist);
    return { clinic: await this.clinicSettings.get(), fonts: this.fonts };
  }

  /**
   * The clinic, and the preferred name of the client the e-mail behind `token` was about (null when
   * the token is unknown or the client has none).
   */
  async forToken(token: string): Promise<StopPageContext> {
    const [row] = await this.dataSource.query<{ preferred_name: string | null }[]>(
      `SELECT c.preferred_name FROM summary_recipients r
         JOIN summaries s ON s.id = r.summary_id
         JOIN clients c ON c.id = s.client_id
        WHERE r.stop_token = $1`,
      [token],
    );
    return { ...(await this.clinic()), clientName: row?.preferred_name ?? null };
  }
}
