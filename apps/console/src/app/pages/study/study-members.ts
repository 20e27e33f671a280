import { LiveAnnouncer } from '@angular/cdk/a11y';
import { ChangeDetectionStrategy, Component, inject, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatSelectModule } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import { STUDY_ROLES, type StudyDetail, type StudyMember, type StudyRole } from '@tallyfit/contracts';
import { StudiesApi } from '../../core/api/studies-api';
import { AddMemberDialog, type AddMemberData } from './add-member-dialog';
import { STUDY_ROLE_WORDS } from './study-role-words';

/** Who belongs to a study and in which role; its managers add, change and remove members. */
@Component({
  selector: 'tf-study-members',
  imports: [MatButtonModule, MatFormFieldModule, MatIconModule, MatSelectModule, MatTableModule],
  templateUrl: './study-members.html',
  styleUrl: './study-members.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StudyMembers {
  private readonly api = inject(StudiesApi);
  private readonly dialog = inject(MatDialog);
  private readonly announcer = inject(LiveAnnouncer);

  readonly study = input.required<StudyDetail>();
  /** Whether the signed-in person may change the members. */
  readonly manage = input(false);
  /** The study after a change, so the page shows what the API stored. */
  readonly changed = output<StudyDetail>();

  protected readonly roles = STUDY_ROLES;
  protected roleWord(role: StudyRole): string {
    return STUDY_ROLE_WORDS[role];
  }
  protected columns(manage: boolean): string[] {
    return manage ? ['name', 'role', 'studyRole', 'remove'] : ['name', 'role', 'studyRole'];
  }

  protected changeRole(member: StudyMember, studyRole: StudyRole): void {
    if (studyRole === member.studyRole) return;
    this.api.changeMemberRole(this.study().id, member.userId, studyRole).subscribe({
      next: (study) => {
        this.changed.emit(study);
        void this.announcer.announce(`${member.name} is now ${STUDY_ROLE_WORDS[studyRole].toLowerCase()} of the study.`);
      },
      // The notifier has told the person why; show the role the API still holds.
      error: () => {
        const current = this.study();
        this.changed.emit({ ...current, members: current.members.map((m) => ({ ...m })) });
      },
    });
  }

  protected remove(member: StudyMember): void {
    const study = this.study();
    this.api.removeMember(study.id, member.userId).subscribe(() => {
      this.changed.emit({
        ...study,
        members: study.members.filter((m) => m.userId !== member.userId),
        memberCount: study.memberCount - 1,
      });
      void this.announcer.announce(`${member.name} was removed from the study.`);
    });
  }

  protected add(): void {
    const study = this.study();
    this.dialog
      .open<AddMemberDialog, AddMemberData, StudyDetail>(AddMemberDialog, {
        data: { studyId: study.id, memberIds: study.members.map((member) => member.userId) },
      })
      .afterClosed()
      .subscribe((updated) => {
        if (!updated) return;
        this.changed.emit(updated);
        void this.announcer.announce('Member added.');
      });
  }
}
