// Cross-feature pieces for every feature module.
export { ApiExceptionFilter } from './filters/api-exception.filter';
export { SignedInGuard } from './guards/signed-in.guard';
export { AdminGuard } from './guards/admin.guard';
export { CurrentUser } from './decorators/current-user.decorator';
export { createValidationPipe, validationException } from './pipes/validation';
export { Csrf, CSRF_COOKIE } from './middleware/csrf';
export { PageDto } from './dto/page.dto';
