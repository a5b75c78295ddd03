import { Global, Module } from '@nestjs/common';
import type { ConfigType } from '@nestjs/config';
import { appConfig } from '../config/app.config';
import { Csrf } from './middleware/csrf';

/** App-wide singletons every feature may inject. */
@Global()
@Module({
  providers: [{ provide: Csrf, inject: [appConfig.KEY], useFactory: (cfg: ConfigType<typeof appConfig>) => new Csrf(cfg.sessionSecret) }],
  exports: [Csrf],
})
export class CommonModule {}
