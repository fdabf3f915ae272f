import { inject, Injectable } from '@angular/core';
import { Title } from '@angular/platform-browser';
import { RouterStateSnapshot, TitleStrategy } from '@angular/router';

const PRODUCT_NAME = 'Plyledger';

/** Browser tab titles read "Page – Plyledger", so open tabs can be told apart. */
@Injectable()
export class PageTitleStrategy extends TitleStrategy {
  private readonly title = inject(Title);

  override updateTitle(snapshot: RouterStateSnapshot): void {
    const pageTitle = this.buildTitle(snapshot);
    this.title.setTitle(pageTitle ? `${pageTitle} – ${PRODUCT_NAME}` : PRODUCT_NAME);
  }
}
