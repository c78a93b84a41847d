export const demoProjectName = 'Alder Bay Library & Makerspace';

export interface DemoUser {
  email: string;
  name: string;
  isAdmin: boolean;
  projectRole: 'engineer' | 'reviewer' | 'contractor' | null;
}

/** The invented demo team. Their password comes from DEMO_PASSWORD at seed time. */
export const demoUsers: readonly DemoUser[] = [
  { email: 'engineer@alderbay.example', name: 'Ines Halvorsen', isAdmin: false, projectRole: 'engineer' },
  { email: 'reviewer@alderbay.example', name: 'Dario Quint', isAdmin: false, projectRole: 'reviewer' },
  { email: 'contractor@alderbay.example', name: 'Noor Abernathy', isAdmin: false, projectRole: 'contractor' },
  { email: 'admin@alderbay.example', name: 'Sam Ferreira', isAdmin: true, projectRole: null },
];
